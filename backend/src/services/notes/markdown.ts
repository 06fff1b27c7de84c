import MarkdownIt from 'markdown-it';
import type { MarkdownIt as MarkdownItInstance, StateBlock, StateInline } from 'markdown-it';
import katex from 'katex';
import { escapeHtml } from './format';

/**
 * The one Markdown renderer of notes: CommonMark plus GitHub's tables and strikethrough, raw HTML
 * disabled, links autolinked, and TeX between `$…$` (inline) or `$$…$$` (display) rendered with
 * KaTeX. Fenced blocks with the info string `veracast` are rendered by the caller (live blocks).
 */
export function createNoteMarkdown(renderLiveBlock: (body: string, env: unknown) => string): MarkdownItInstance {
  const md = new MarkdownIt({ html: false, linkify: true, typographer: false });
  md.inline.ruler.after('escape', 'math_inline', mathInline);
  md.block.ruler.before('paragraph', 'math_block', mathBlock, { alt: ['paragraph', 'reference', 'blockquote', 'list'] });
  md.renderer.rules.math_inline = (tokens, idx) => renderTex(tokens[idx]!.content, false);
  md.renderer.rules.math_display_inline = (tokens, idx) => renderTex(tokens[idx]!.content, true);
  md.renderer.rules.math_block = (tokens, idx) => `<div class="vc-math-display">${renderTex(tokens[idx]!.content, true)}</div>\n`;
  // The page around a note owns its one h1 (the title): Markdown headings move one level down.
  md.core.ruler.push('vc_heading_shift', (state) => {
    for (const t of state.tokens) if (t.type === 'heading_open' || t.type === 'heading_close') t.tag = `h${Math.min(6, Number(t.tag.slice(1)) + 1)}`;
  });
  const defaultFence = md.renderer.rules.fence!;
  md.renderer.rules.fence = (tokens, idx, options, env, self) => {
    const token = tokens[idx]!;
    if (token.info.trim().split(/\s+/)[0] === 'veracast') return renderLiveBlock(token.content, env) + '\n';
    return defaultFence(tokens, idx, options, env, self);
  };
  return md;
}

export function renderTex(source: string, displayMode: boolean): string {
  try {
    return katex.renderToString(source, { displayMode, throwOnError: false, output: 'htmlAndMathml', strict: 'ignore', trust: false, maxSize: 50, maxExpand: 500 });
  } catch {
    // throwOnError=false covers parse errors; anything else (e.g. a macro expansion limit) shows the source.
    return `<code class="vc-tex-error">${escapeHtml(source)}</code>`;
  }
}

const DOLLAR = 0x24;
const BACKSLASH = 0x5c;
const isSpace = (c: number) => c === 0x20 || c === 0x09 || c === 0x0a;

/** `$x$` inline and `$$x$$` inside a paragraph. `$` followed by a space, or a closing `$` followed by a digit, is plain text (prices). */
function mathInline(state: StateInline, silent: boolean): boolean {
  const src = state.src;
  const start = state.pos;
  if (src.charCodeAt(start) !== DOLLAR) return false;
  const display = src.charCodeAt(start + 1) === DOLLAR;
  const marker = display ? '$$' : '$';
  const from = start + marker.length;
  if (!display && (from >= state.posMax || isSpace(src.charCodeAt(from)))) return false;
  let end = from;
  for (;;) {
    end = src.indexOf(marker, end);
    if (end === -1 || end >= state.posMax) return false;
    if (src.charCodeAt(end - 1) === BACKSLASH) {
      end += 1;
      continue;
    }
    break;
  }
  if (end === from) return false;
  if (!display) {
    if (isSpace(src.charCodeAt(end - 1))) return false;
    const after = src.charCodeAt(end + 1);
    if (after >= 0x30 && after <= 0x39) return false;
  }
  if (!silent) {
    const token = state.push(display ? 'math_display_inline' : 'math_inline', 'math', 0);
    token.markup = marker;
    token.content = src.slice(from, end);
  }
  state.pos = end + marker.length;
  return true;
}

/** A paragraph that starts with `$$` and ends (same or a later line) with `$$`. */
function mathBlock(state: StateBlock, startLine: number, endLine: number, silent: boolean): boolean {
  if (state.sCount[startLine]! - state.blkIndent >= 4) return false;
  const begin = state.bMarks[startLine]! + state.tShift[startLine]!;
  const max = state.eMarks[startLine]!;
  if (state.src.slice(begin, begin + 2) !== '$$') return false;
  const first = state.src.slice(begin + 2, max);
  const lines: string[] = [];
  let last = startLine;
  let found = false;
  if (first.trim().endsWith('$$')) {
    lines.push(first.trim().slice(0, -2));
    found = true;
  } else {
    lines.push(first);
    for (let line = startLine + 1; line < endLine; line++) {
      const s = state.bMarks[line]! + state.tShift[line]!;
      const e = state.eMarks[line]!;
      if (s < e && state.sCount[line]! < state.blkIndent) break;
      const text = state.src.slice(s, e);
      if (text.trim().endsWith('$$')) {
        lines.push(text.trim().slice(0, -2));
        last = line;
        found = true;
        break;
      }
      lines.push(text);
    }
  }
  if (!found) return false;
  if (silent) return true;
  state.line = last + 1;
  const token = state.push('math_block', 'math', 0);
  token.block = true;
  token.content = lines.join('\n').trim();
  token.map = [startLine, state.line];
  token.markup = '$$';
  return true;
}
