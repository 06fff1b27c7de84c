/**
 * A small reader for the HTML that `sanitizeNoteHtml` produces (well-formed, quoted attributes,
 * escaped text), so the PDF writer can walk the same frozen HTML the public page shows. It is not
 * a general HTML parser: unknown end tags are ignored and unclosed elements close at the end.
 */
export interface HtmlElement {
  tag: string;
  attrs: Record<string, string>;
  children: HtmlNode[];
}
export type HtmlNode = HtmlElement | string;

const VOID = new Set(['br', 'hr', 'img', 'input', 'meta', 'link']);
const NAMED: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'", nbsp: '\u00a0' };

export function decodeEntities(text: string): string {
  return text.replace(/&(#x[0-9a-fA-F]+|#[0-9]+|[a-zA-Z]+);/g, (whole, body: string) => {
    if (body.startsWith('#x') || body.startsWith('#X')) return safeCodePoint(parseInt(body.slice(2), 16), whole);
    if (body.startsWith('#')) return safeCodePoint(parseInt(body.slice(1), 10), whole);
    return NAMED[body] ?? whole;
  });
}

function safeCodePoint(cp: number, fallback: string): string {
  return Number.isInteger(cp) && cp > 0 && cp <= 0x10ffff ? String.fromCodePoint(cp) : fallback;
}

export function parseHtml(html: string): HtmlElement {
  const root: HtmlElement = { tag: '#root', attrs: {}, children: [] };
  const stack: HtmlElement[] = [root];
  const tagRe = /<(\/?)([a-zA-Z][a-zA-Z0-9:-]*)((?:\s+[^\s=/>]+(?:\s*=\s*"[^"]*")?)*)\s*(\/?)>|<!--[\s\S]*?-->/g;
  let last = 0;
  for (let m = tagRe.exec(html); m; m = tagRe.exec(html)) {
    if (m.index > last) stack[stack.length - 1]!.children.push(decodeEntities(html.slice(last, m.index)));
    last = tagRe.lastIndex;
    if (m[0].startsWith('<!--')) continue;
    const closing = m[1] === '/';
    const tag = m[2]!.toLowerCase();
    if (closing) {
      const at = stack.map((e) => e.tag).lastIndexOf(tag);
      if (at > 0) stack.length = at;
      continue;
    }
    const attrs: Record<string, string> = {};
    for (const a of (m[3] ?? '').matchAll(/([^\s=/>]+)(?:\s*=\s*"([^"]*)")?/g)) attrs[a[1]!.toLowerCase()] = decodeEntities(a[2] ?? '');
    const el: HtmlElement = { tag, attrs, children: [] };
    stack[stack.length - 1]!.children.push(el);
    if (!VOID.has(tag) && m[4] !== '/') stack.push(el);
  }
  if (last < html.length) stack[stack.length - 1]!.children.push(decodeEntities(html.slice(last)));
  return root;
}

/** The text of a node and its descendants. */
export function textOf(node: HtmlNode): string {
  return typeof node === 'string' ? node : node.children.map(textOf).join('');
}

export const hasClass = (el: HtmlElement, cls: string) => (el.attrs.class ?? '').split(/\s+/).includes(cls);

/** First descendant element matching `pred`, depth first. */
export function findElement(node: HtmlElement, pred: (el: HtmlElement) => boolean): HtmlElement | null {
  for (const c of node.children) {
    if (typeof c === 'string') continue;
    if (pred(c)) return c;
    const inner = findElement(c, pred);
    if (inner) return inner;
  }
  return null;
}
