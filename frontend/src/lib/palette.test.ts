import { afterEach, describe, expect, it } from 'vitest';
import { paletteColor } from './palette';

afterEach(() => document.documentElement.style.removeProperty('--color-accent-700'));

describe('paletteColor', () => {
  it('reads a token set on the page and falls back when it is missing', () => {
    document.documentElement.style.setProperty('--color-accent-700', ' #1f5559 ');
    expect(paletteColor('accent-700')).toBe('#1f5559');
    expect(paletteColor('no-such-token')).toBe('currentColor');
    expect(paletteColor('no-such-token', '#000000')).toBe('#000000');
  });
});
