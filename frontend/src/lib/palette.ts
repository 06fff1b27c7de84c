/**
 * A palette token of index.css (`--color-<name>`) as the colour it stands for on this page, so a
 * chart drawn with it keeps its colours when saved as a file; `fallback` outside a browser or
 * when the token is not set.
 */
export function paletteColor(name: string, fallback = 'currentColor'): string {
  if (typeof document === 'undefined') return fallback;
  return getComputedStyle(document.documentElement).getPropertyValue(`--color-${name}`).trim() || fallback;
}
