import { useSyncExternalStore } from 'react';

/**
 * Light or dark, or whatever the device asks for (prefers-color-scheme). The choice is kept
 * in localStorage and applied as <html data-theme>; index.html applies it before first paint
 * and tailwind.config.ts maps both themes onto the same CSS variables.
 */
export const themePreferences = ['device', 'light', 'dark'] as const;
export type ThemePreference = (typeof themePreferences)[number];

// index.html reads the same key before the app loads.
const storageKey = 'varden.theme';
const listeners = new Set<() => void>();

function readPreference(): ThemePreference {
  try {
    const stored = localStorage.getItem(storageKey);
    return stored === 'light' || stored === 'dark' ? stored : 'device';
  } catch {
    return 'device';
  }
}

export function setThemePreference(preference: ThemePreference): void {
  try {
    if (preference === 'device') localStorage.removeItem(storageKey);
    else localStorage.setItem(storageKey, preference);
  } catch {
    // Storage may be blocked; the choice still applies until the page reloads.
  }
  if (preference === 'device') delete document.documentElement.dataset.theme;
  else document.documentElement.dataset.theme = preference;
  for (const listener of listeners) listener();
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  // Another tab changed the choice.
  const onStorage = (event: StorageEvent) => {
    if (event.key !== storageKey) return;
    const preference = readPreference();
    if (preference === 'device') delete document.documentElement.dataset.theme;
    else document.documentElement.dataset.theme = preference;
    listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

export function useThemePreference(): ThemePreference {
  return useSyncExternalStore(subscribe, readPreference, () => 'device');
}
