import { useEffect } from 'react';
import { useBlocker } from 'react-router-dom';

/**
 * Leaving the page with unsaved edits asks first: a route change is held by the returned blocker
 * (the page shows its dialog), and reloads or closing the tab get the browser's own question.
 */
export function useUnsavedEditsGuard(hasChanges: boolean) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => hasChanges && currentLocation.pathname !== nextLocation.pathname);

  useEffect(() => {
    if (!hasChanges) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [hasChanges]);

  return blocker;
}
