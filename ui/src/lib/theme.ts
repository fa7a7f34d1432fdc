import { useCallback, useSyncExternalStore } from 'react';
import { createDarkTheme, createLightTheme, type BrandVariants, type Theme } from '@fluentui/react-components';

// Beamwright's own brand ramp: a deep petrol teal, from near-black (10) to a pale mist (160).
const petrol: BrandVariants = {
  10: '#031417',
  20: '#06232a',
  30: '#0a2f38',
  40: '#0c3c47',
  50: '#0e4956',
  60: '#0f5766',
  70: '#0f6676',
  80: '#0d7586',
  90: '#12859a',
  100: '#2294a8',
  110: '#3ca3b5',
  120: '#58b2c2',
  130: '#76c1cf',
  140: '#96d0db',
  150: '#b7dfe7',
  160: '#d9eff3',
};

const fontFamily = "'Open Sans', 'Segoe UI', system-ui, -apple-system, sans-serif";

export const lightTheme: Theme = {
  ...createLightTheme(petrol),
  fontFamilyBase: fontFamily,
};

export const darkTheme: Theme = {
  ...createDarkTheme(petrol),
  fontFamilyBase: fontFamily,
  // Fluent's advice for dark themes: lift brand foregrounds so they stay readable.
  colorBrandForeground1: petrol[120],
  colorBrandForeground2: petrol[130],
  colorBrandForegroundLink: petrol[130],
};

/** Colours the charts share with the rest of the UI (ECharts does not read Fluent tokens). */
export const beamPalette = {
  beam: '#e8a33d',
  aperture: '#2294a8',
  good: '#2e8b57',
  poor: '#c2410c',
  loss: '#b45309',
  neutral: '#64748b',
};

export type ThemeMode = 'light' | 'dark';
const STORAGE_KEY = 'beamwright.theme';
const listeners = new Set<() => void>();

function preferredMode(): ThemeMode {
  const stored = window.localStorage.getItem(STORAGE_KEY);
  if (stored === 'light' || stored === 'dark') return stored;
  return window.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
}

// A choice made in another tab (a storage event) or a change of the system setting applies here too.
function subscribe(listener: () => void) {
  listeners.add(listener);
  const onStorage = (event: StorageEvent) => {
    if (event.key === STORAGE_KEY || event.key === null) listener();
  };
  const systemQuery = window.matchMedia?.('(prefers-color-scheme: dark)');
  window.addEventListener('storage', onStorage);
  systemQuery?.addEventListener?.('change', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
    systemQuery?.removeEventListener?.('change', listener);
  };
}

/** The theme mode, remembered across visits and shared by the open tabs; follows the system until the user picks one. */
export function useThemeMode(): [ThemeMode, (mode: ThemeMode) => void] {
  const mode = useSyncExternalStore(subscribe, preferredMode, () => 'light' as const);
  const setMode = useCallback((next: ThemeMode) => {
    window.localStorage.setItem(STORAGE_KEY, next);
    for (const listener of listeners) listener();
  }, []);
  return [mode, setMode];
}
