export type TextSegment = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
const TRAILING_PUNCTUATION = /[.,;:!?)\]}]+$/;

/**
 * Splits plain text into text and link segments so that a mail body can show its http(s) URLs as
 * links. Punctuation that ends a sentence is kept out of the link; nothing else is recognised.
 */
export function linkify(text: string): TextSegment[] {
  const segments: TextSegment[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    const trailing = TRAILING_PUNCTUATION.exec(match[0])?.[0] ?? '';
    const href = match[0].slice(0, match[0].length - trailing.length);
    if (start > last) segments.push({ kind: 'text', text: text.slice(last, start) });
    segments.push({ kind: 'link', text: href, href });
    last = start + href.length;
  }
  if (last < text.length) segments.push({ kind: 'text', text: text.slice(last) });
  return segments;
}
