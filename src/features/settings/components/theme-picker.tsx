import { useState } from 'react';
import { applyTheme, storedTheme } from '@/lib/theme';
import type { ThemeName } from '@/styles/palette';

const CHOICES: { value: ThemeName; label: string; hint: string }[] = [
  { value: 'light', label: 'Light', hint: 'For daylight and bright rooms' },
  { value: 'dark', label: 'Dark', hint: 'Easy on the eyes indoors' },
  { value: 'night', label: 'Night (red)', hint: 'Dim red on black for a dark room' },
];

export function ThemePicker() {
  const [theme, setTheme] = useState<ThemeName>(storedTheme);
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-bold">Theme</legend>
      {CHOICES.map((c) => (
        <label
          key={c.value}
          className="flex min-h-target cursor-pointer items-center gap-3 rounded-xl border-2 border-border bg-surface px-3"
        >
          <input
            type="radio"
            name="theme"
            value={c.value}
            className="h-6 w-6 accent-[var(--c-primary)]"
            checked={theme === c.value}
            onChange={() => {
              applyTheme(c.value);
              setTheme(c.value);
            }}
          />
          <span>
            <span className="font-bold">{c.label}</span>
            <span className="block text-sm text-muted">{c.hint}</span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}
