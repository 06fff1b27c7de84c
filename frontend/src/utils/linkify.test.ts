import { describe, expect, it } from 'vitest';
import { linkify } from './linkify';

describe('linkify', () => {
  it('turns an invitation URL into a link and keeps the surrounding text', () => {
    const text = 'Open http://127.0.0.1:8080/invite/abc123 to join.\nThanks';
    expect(linkify(text)).toEqual([
      { kind: 'text', text: 'Open ' },
      { kind: 'link', text: 'http://127.0.0.1:8080/invite/abc123', href: 'http://127.0.0.1:8080/invite/abc123' },
      { kind: 'text', text: ' to join.\nThanks' },
    ]);
  });

  it('leaves sentence punctuation out of the link', () => {
    const segments = linkify('See https://example.org/reset/xyz.');
    expect(segments[1]).toEqual({ kind: 'link', text: 'https://example.org/reset/xyz', href: 'https://example.org/reset/xyz' });
    expect(segments[2]).toEqual({ kind: 'text', text: '.' });
  });

  it('links nothing but http(s) addresses', () => {
    expect(linkify('javascript:alert(1) and mailto:a@b.org')).toEqual([
      { kind: 'text', text: 'javascript:alert(1) and mailto:a@b.org' },
    ]);
  });

  it('joins the segments back into the original text', () => {
    const text = 'a https://x.org/1, b http://y.org/2) c';
    expect(linkify(text).map((s) => s.text).join('')).toBe(text);
  });
});
