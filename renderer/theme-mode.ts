/**
 * The colour theme: "system" follows the operating system's light or dark setting; "light" and
 * "dark" override it. The choice is the user's own (kept in this browser profile's storage, not in
 * the project file); the page carries the theme in use as `<html data-theme="light|dark">`, which
 * the palette in `styles/base.css` keys on.
 */
import { ref } from 'vue';

export type ThemeChoice = 'system' | 'light' | 'dark';
export const THEME_CHOICES: readonly { id: ThemeChoice; label: string }[] = [
  { id: 'system', label: 'System' },
  { id: 'light', label: 'Light' },
  { id: 'dark', label: 'Dark' },
];
const STORAGE_KEY = 'droopline.theme';

/** The user's choice. */
export const themeChoice = ref<ThemeChoice>('system');
/** The theme in use (the choice, or the system's for "system"). */
export const themeInUse = ref<'light' | 'dark'>('light');

const darkQuery = (): MediaQueryList | null => (typeof matchMedia === 'function' ? matchMedia('(prefers-color-scheme: dark)') : null);

/** The theme `choice` gives when the system prefers dark (`systemDark`) or not. */
export function resolveTheme(choice: ThemeChoice, systemDark: boolean): 'light' | 'dark' {
  return choice === 'system' ? (systemDark ? 'dark' : 'light') : choice;
}

function apply(): void {
  themeInUse.value = resolveTheme(themeChoice.value, darkQuery()?.matches ?? false);
  if (typeof document !== 'undefined') document.documentElement.dataset.theme = themeInUse.value;
}

/** Sets and remembers the choice. */
export function chooseTheme(choice: ThemeChoice): void {
  themeChoice.value = choice;
  try {
    localStorage.setItem(STORAGE_KEY, choice);
  } catch {
    // Storage may be off (private window): the choice holds for this session.
  }
  apply();
}

/** Reads the remembered choice, applies it and follows the system's setting from now on. */
export function startTheme(): void {
  try {
    const saved = localStorage.getItem(STORAGE_KEY);
    if (saved === 'light' || saved === 'dark' || saved === 'system') themeChoice.value = saved;
  } catch {
    // No storage: "system".
  }
  darkQuery()?.addEventListener?.('change', apply);
  apply();
}
