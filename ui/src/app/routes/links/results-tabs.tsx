import { useState, type ReactNode } from 'react';
import { Tab, TabList, makeStyles, tokens } from '@fluentui/react-components';
import { CalculatorRegular, DataAreaRegular } from '@fluentui/react-icons';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalM, minWidth: 0 },
});

export type ResultsView = 'budget' | 'explore';

/**
 * The workspace's right-hand column: the budget of the design, or the margin explorer. A view once
 * opened stays mounted (hidden) so its settings and its last chart survive a switch.
 */
export function ResultsTabs({ budget, explore }: { budget: ReactNode; explore: ReactNode }) {
  const styles = useStyles();
  const [view, setView] = useState<ResultsView>('budget');
  const [opened, setOpened] = useState<ReadonlySet<ResultsView>>(new Set(['budget']));
  const select = (next: ResultsView) => {
    setView(next);
    setOpened((previous) => new Set(previous).add(next));
  };
  return (
    <div className={styles.root}>
      <TabList selectedValue={view} onTabSelect={(_, data) => select(data.value as ResultsView)} aria-label="Results">
        <Tab value="budget" icon={<CalculatorRegular />} id="results-tab-budget" aria-controls="results-panel-budget">
          Budget
        </Tab>
        <Tab value="explore" icon={<DataAreaRegular />} id="results-tab-explore" aria-controls="results-panel-explore" data-testid="results-tab-explore">
          Explore
        </Tab>
      </TabList>
      <div role="tabpanel" id="results-panel-budget" aria-labelledby="results-tab-budget" hidden={view !== 'budget'}>
        {budget}
      </div>
      <div role="tabpanel" id="results-panel-explore" aria-labelledby="results-tab-explore" hidden={view !== 'explore'}>
        {opened.has('explore') && explore}
      </div>
    </div>
  );
}
