import { useState, type JSX, type ReactNode } from 'react';
import { Tab, TabList, makeStyles, tokens } from '@fluentui/react-components';
import { BranchForkRegular, CalculatorRegular, DataAreaRegular } from '@fluentui/react-icons';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalM, minWidth: 0 },
  // at 320 px the three tabs wrap instead of pushing the page sideways
  tabs: { flexWrap: 'wrap' },
});

export type ResultsView = 'budget' | 'explore' | 'alternatives';

const VIEWS: { value: ResultsView; label: string; icon: JSX.Element }[] = [
  { value: 'budget', label: 'Budget', icon: <CalculatorRegular /> },
  { value: 'explore', label: 'Explore', icon: <DataAreaRegular /> },
  { value: 'alternatives', label: 'Alternatives', icon: <BranchForkRegular /> },
];

/**
 * The workspace's right-hand column: the budget of the design, the margin explorer, or the design's
 * alternatives side by side. A view once opened stays mounted (hidden), so its settings and its last
 * chart survive a switch.
 */
export function ResultsTabs({ views, alternativesCount }: { views: Record<ResultsView, ReactNode>; alternativesCount?: number }) {
  const styles = useStyles();
  const [view, setView] = useState<ResultsView>('budget');
  const [opened, setOpened] = useState<ReadonlySet<ResultsView>>(new Set(['budget']));
  const select = (next: ResultsView) => {
    setView(next);
    setOpened((previous) => new Set(previous).add(next));
  };
  return (
    <div className={styles.root}>
      <TabList className={styles.tabs} selectedValue={view} onTabSelect={(_, data) => select(data.value as ResultsView)} aria-label="Results">
        {VIEWS.map(({ value, label, icon }) => (
          <Tab key={value} value={value} icon={icon} id={`results-tab-${value}`} aria-controls={`results-panel-${value}`} data-testid={`results-tab-${value}`}>
            {label}
            {value === 'alternatives' && alternativesCount ? ` (${alternativesCount})` : ''}
          </Tab>
        ))}
      </TabList>
      {VIEWS.map(({ value }) => (
        <div key={value} role="tabpanel" id={`results-panel-${value}`} aria-labelledby={`results-tab-${value}`} hidden={view !== value}>
          {opened.has(value) && views[value]}
        </div>
      ))}
    </div>
  );
}
