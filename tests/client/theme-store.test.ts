import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { THEME_STORAGE_KEY, useThemeStore } from '@/stores/theme.store';

function prefersDark(matches: boolean) {
  vi.stubGlobal(
    'matchMedia',
    vi.fn((query: string) => ({
      matches: query === '(prefers-color-scheme: dark)' && matches,
      media: query,
      addEventListener: () => undefined,
      removeEventListener: () => undefined,
    })),
  );
}

beforeEach(() => {
  localStorage.clear();
  setActivePinia(createPinia());
});

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('useThemeStore', () => {
  it('starts from the system preference when nothing is remembered', () => {
    prefersDark(true);
    expect(useThemeStore().mode).toBe('dark');
  });

  it('starts light when the system has no dark preference', () => {
    prefersDark(false);
    expect(useThemeStore().mode).toBe('light');
  });

  it('remembers the choice across a reload', () => {
    prefersDark(false);
    const first = useThemeStore();
    first.toggle();
    expect(first.mode).toBe('dark');
    expect(localStorage.getItem(THEME_STORAGE_KEY)).toBe('dark');

    // A new pinia stands for a new page load.
    setActivePinia(createPinia());
    expect(useThemeStore().mode).toBe('dark');
  });

  it('prefers the remembered choice over the system preference', () => {
    localStorage.setItem(THEME_STORAGE_KEY, 'light');
    prefersDark(true);
    expect(useThemeStore().isDark).toBe(false);
  });

  it('ignores a remembered value it does not know', () => {
    localStorage.setItem(THEME_STORAGE_KEY, 'sepia');
    prefersDark(false);
    expect(useThemeStore().mode).toBe('light');
  });
});
