import { Suspense, type ReactNode } from 'react';
import { FluentProvider, Spinner, makeStyles, tokens } from '@fluentui/react-components';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { queryClient as defaultQueryClient } from '@/lib/query-client';
import { darkTheme, lightTheme, useThemeMode } from '@/lib/theme';

const useStyles = makeStyles({
  root: {
    minHeight: '100vh',
    backgroundColor: tokens.colorNeutralBackground2,
    color: tokens.colorNeutralForeground1,
  },
  loading: { display: 'grid', placeItems: 'center', minHeight: '100vh' },
});

export function ThemedRoot({ children }: { children: ReactNode }) {
  const [mode] = useThemeMode();
  const styles = useStyles();
  return (
    // Layout styles go on an inner element: Fluent copies the provider's classes to portal nodes
    // (tooltips, dialogs), which must not cover the page.
    <FluentProvider theme={mode === 'dark' ? darkTheme : lightTheme} data-theme={mode}>
      <div className={styles.root}>{children}</div>
    </FluentProvider>
  );
}

function PageSpinner() {
  const styles = useStyles();
  return (
    <div className={styles.loading}>
      <Spinner label="Loading Beamwright…" />
    </div>
  );
}

export function AppProvider({ children, queryClient = defaultQueryClient }: { children: ReactNode; queryClient?: QueryClient }) {
  return (
    <QueryClientProvider client={queryClient}>
      <ThemedRoot>
        <Suspense fallback={<PageSpinner />}>{children}</Suspense>
      </ThemedRoot>
    </QueryClientProvider>
  );
}
