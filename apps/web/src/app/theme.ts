// Light or dim. Dim is for a dark bar at night: the person's choice is remembered on this device; until they choose,
// the phone's own setting (prefers-color-scheme) decides. styles.css holds both palettes.
import { useSyncExternalStore } from 'react';

export type Theme = 'light' | 'dim';
const STORAGE_KEY = 'bumperline-theme';
const darkQuery = () => window.matchMedia?.('(prefers-color-scheme: dark)');

function storedChoice(): Theme | null {
  try {
    const v = localStorage.getItem(STORAGE_KEY);
    return v === 'light' || v === 'dim' ? v : null;
  } catch {
    return null;
  }
}

export function currentTheme(): Theme {
  return storedChoice() ?? (darkQuery()?.matches ? 'dim' : 'light');
}

const listeners = new Set<() => void>();
function apply() {
  document.documentElement.dataset.theme = currentTheme();
  for (const l of listeners) l();
}

/** Sets the theme on <html> at start and follows the phone's setting while no choice is stored. */
export function applyStoredTheme(): void {
  apply();
  darkQuery()?.addEventListener?.('change', apply);
}

export function chooseTheme(theme: Theme): void {
  localStorage.setItem(STORAGE_KEY, theme);
  apply();
}

export function useTheme(): [Theme, (t: Theme) => void] {
  const theme = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    currentTheme,
    () => 'light' as Theme,
  );
  return [theme, chooseTheme];
}
