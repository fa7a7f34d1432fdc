import { makeStyles, tokens } from '@fluentui/react-components';

/** Two columns: the design on the left, the results beside it (their margin headline stays in view). */
export const useWorkspaceStyles = makeStyles({
  layout: {
    display: 'grid',
    gridTemplateColumns: 'minmax(360px, 500px) minmax(0, 1fr)',
    columnGap: tokens.spacingHorizontalXL,
    alignItems: 'start',
    '@media (max-width: 1100px)': { gridTemplateColumns: '1fr', rowGap: tokens.spacingVerticalXL },
  },
  results: { minWidth: 0 },
});
