import { useId } from 'react';
import { setThemePreference, themePreferences, useThemePreference, type ThemePreference } from '../lib/theme-preference';

const labels: Record<ThemePreference, string> = { device: 'Device', light: 'Light', dark: 'Dark' };

/** Three-way theme choice for the frame (rail or phone menu). */
export function ThemeSwitch() {
  const preference = useThemePreference();
  const name = useId();
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 text-base font-medium text-frame-ink-muted desk:text-xs">Theme</legend>
      <div className="grid grid-cols-3 rounded border border-frame-ink-muted">
        {themePreferences.map((option) => (
          <label
            key={option}
            className="flex min-h-touch cursor-pointer items-center justify-center text-base text-frame-ink desk:text-sm has-checked:bg-frame-active has-checked:font-semibold has-focus-visible:outline-3 has-focus-visible:outline-offset-[-3px] has-focus-visible:outline-frame-focus desk:min-h-control"
          >
            <input
              type="radio"
              name={name}
              value={option}
              checked={preference === option}
              onChange={() => setThemePreference(option)}
              className="sr-only"
            />
            {preference === option && (
              <svg aria-hidden="true" viewBox="0 0 16 16" className="mr-1 size-3 fill-none stroke-frame-focus stroke-2">
                <path d="M2.5 8.5 6.5 12 13.5 4" />
              </svg>
            )}
            {labels[option]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
