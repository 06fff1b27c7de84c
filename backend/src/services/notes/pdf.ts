import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { findElement, hasClass, parseHtml, textOf, type HtmlElement, type HtmlNode } from './html-tree';

export interface NotePdfInput {
  title: string;
  /** The frozen, sanitised HTML of the published version. */
  html: string;
  publishedAt: string;
  updatedAt: string;
  version: number;
  publicUrl: string;
  audits: { id: number; name: string; dataHash: string; coreVersion: string }[];
  corrections: { version: number; date: string; notice: string }[];
  cautions: readonly string[];
  fictional: boolean;
}

const require = createRequire(import.meta.url);
const fontFile = (weight: number, style: 'normal' | 'italic') => require.resolve(`@fontsource/work-sans/files/work-sans-latin-${weight}-${style}.woff`);
const FONTS = { regular: fontFile(400, 'normal'), italic: fontFile(400, 'italic'), bold: fontFile(600, 'normal'), boldItalic: fontFile(600, 'italic') };
const MONO = 'Courier';

const INK = '#1e293b';
const MUTED = '#475569';
const RULE = '#cbd5e1';
const ACCENT = '#0f5f63';
const CAUTION = '#8a4b08';
const BODY = 10.5;

const BLOCK_TAGS = new Set(['p', 'h1', 'h2', 'h3', 'h4', 'h5', 'h6', 'ul', 'ol', 'li', 'blockquote', 'pre', 'table', 'figure', 'figcaption', 'section', 'div', 'dl', 'dt', 'dd', 'hr', 'svg']);
const HEADING_SIZE: Record<string, number> = { h1: 18, h2: 15, h3: 13, h4: 11.5, h5: 11, h6: 11 };

interface Run { text: string; bold?: boolean; italic?: boolean; mono?: boolean; link?: string; strike?: boolean }

/** Courier is a standard PDF font with a Latin-1 encoding; other characters become "?". */
const latin1 = (s: string) => s.replace(/[^\u0020-\u00ff\n\t]/g, (c) => ({ '\u2212': '-', '\u2013': '-', '\u2014': '-', '\u2018': "'", '\u2019': "'", '\u201c': '"', '\u201d': '"', '\u2026': '...' })[c] ?? '?');

/**
 * Writes the PDF of a published note with pdfkit: the same frozen HTML as the public page (text,
 * tables, the SVG charts drawn as vector graphics, formulas as their TeX source), then the cited
 * audits with their data hashes, the correction history and the cautions. Work Sans is embedded;
 * every page's footer repeats the publication date and the data hash.
 */
export async function writeNotePdf(input: NotePdfInput): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4', margins: { top: 56, bottom: 64, left: 56, right: 56 }, bufferPages: true, lang: 'en',
    info: { Title: input.title, Subject: 'Veracast methodology note', Keywords: input.audits.map((a) => a.dataHash).join(' '), CreationDate: new Date(input.updatedAt) },
  });
  doc.registerFont('regular', FONTS.regular);
  doc.registerFont('italic', FONTS.italic);
  doc.registerFont('bold', FONTS.bold);
  doc.registerFont('boldItalic', FONTS.boldItalic);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  const ensure = (h: number) => {
    if (doc.y + h > bottom()) doc.addPage();
  };
  const gap = (pt: number) => {
    doc.y += pt;
  };
  const fontFor = (r: Run) => (r.mono ? MONO : r.bold && r.italic ? 'boldItalic' : r.bold ? 'bold' : r.italic ? 'italic' : 'regular');

  function writeRuns(runs: Run[], opts: { size?: number; indent?: number; color?: string; align?: 'left' | 'center' } = {}) {
    const cleaned = normaliseRuns(runs);
    if (!cleaned.length) return;
    const size = opts.size ?? BODY;
    const x = left + (opts.indent ?? 0);
    const w = width - (opts.indent ?? 0);
    ensure(size * 1.6);
    doc.fillColor(opts.color ?? INK);
    cleaned.forEach((r, i) => {
      const last = i === cleaned.length - 1;
      doc.font(fontFor(r)).fontSize(size);
      const text = r.mono ? latin1(r.text) : r.text;
      const o = { width: w, continued: !last, link: r.link ?? null, underline: Boolean(r.link), strike: Boolean(r.strike), lineGap: 2, align: opts.align ?? 'left' };
      if (i === 0) doc.text(text, x, doc.y, o);
      else doc.text(text, o);
    });
    doc.x = left;
  }

  function inlineRuns(nodes: readonly HtmlNode[], style: Omit<Run, 'text'> = {}, out: Run[] = []): Run[] {
    for (const n of nodes) {
      if (typeof n === 'string') {
        out.push({ ...style, text: style.mono ? n : n.replace(/\s+/g, ' ') });
        continue;
      }
      if (n.tag === 'span' && hasClass(n, 'katex')) {
        const ann = findElement(n, (e) => e.tag === 'annotation');
        out.push({ ...style, italic: true, text: ` ${ann ? textOf(ann) : textOf(n)} ` });
        continue;
      }
      if (n.tag === 'br') out.push({ ...style, text: '\n' });
      else if (n.tag === 'strong' || n.tag === 'b' || n.tag === 'th') inlineRuns(n.children, { ...style, bold: true }, out);
      else if (n.tag === 'em' || n.tag === 'i' || n.tag === 'cite') inlineRuns(n.children, { ...style, italic: true }, out);
      else if (n.tag === 'code') inlineRuns(n.children, { ...style, mono: true }, out);
      else if (n.tag === 'del' || n.tag === 's') inlineRuns(n.children, { ...style, strike: true }, out);
      else if (n.tag === 'a') {
        const link = safeLink(n.attrs.href, input.publicUrl);
        inlineRuns(n.children, link ? { ...style, link } : style, out);
      } else if (n.tag === 'svg' || n.tag === 'title') continue;
      else inlineRuns(n.children, style, out);
    }
    return out;
  }

  function blocks(nodes: readonly HtmlNode[], indent = 0) {
    let pending: HtmlNode[] = [];
    const flush = () => {
      if (pending.some((p) => typeof p !== 'string' || p.trim())) {
        writeRuns(inlineRuns(pending), { indent });
        gap(4);
      }
      pending = [];
    };
    for (const n of nodes) {
      if (typeof n === 'string' || !BLOCK_TAGS.has(n.tag)) {
        pending.push(n);
        continue;
      }
      flush();
      block(n, indent);
    }
    flush();
  }

  function block(el: HtmlElement, indent: number) {
    const tag = el.tag;
    if (HEADING_SIZE[tag]) {
      gap(6);
      ensure(HEADING_SIZE[tag]! * 3);
      writeRuns(inlineRuns(el.children, { bold: true }), { size: HEADING_SIZE[tag], indent });
      gap(4);
    } else if (tag === 'p') {
      const color = hasClass(el, 'vc-out-of-date') || hasClass(el, 'vc-fictional') ? CAUTION : hasClass(el, 'vc-source') || hasClass(el, 'vc-note-line') ? MUTED : INK;
      writeRuns(inlineRuns(el.children), { indent, color, size: hasClass(el, 'vc-source') || hasClass(el, 'vc-note-line') ? 9 : hasClass(el, 'vc-headline') ? 12 : BODY });
      gap(5);
    } else if (tag === 'ul' || tag === 'ol') {
      let n = Number(el.attrs.start ?? 1);
      for (const li of el.children) {
        if (typeof li === 'string' || li.tag !== 'li') continue;
        const marker = tag === 'ol' ? `${n++}.` : '•';
        const inline = li.children.filter((c) => typeof c === 'string' || !BLOCK_TAGS.has(c.tag) || c.tag === 'p');
        const nested = li.children.filter((c) => typeof c !== 'string' && BLOCK_TAGS.has(c.tag) && c.tag !== 'p');
        const runs = inline.flatMap((c) => (typeof c !== 'string' && c.tag === 'p' ? [...inlineRuns(c.children), { text: ' ' }] : inlineRuns([c])));
        ensure(BODY * 1.6);
        const y = doc.y;
        doc.font('regular').fontSize(BODY).fillColor(INK).text(marker, left + indent, y, { width: 18, lineBreak: false });
        doc.y = y;
        writeRuns(runs, { indent: indent + 18 });
        blocks(nested, indent + 18);
        gap(2);
      }
      gap(4);
    } else if (tag === 'blockquote') {
      const y = doc.y;
      blocks(el.children, indent + 14);
      doc.moveTo(left + indent + 4, y).lineTo(left + indent + 4, doc.y - 4).lineWidth(2).strokeColor(RULE).stroke();
    } else if (tag === 'pre') {
      doc.font(MONO).fontSize(8.5).fillColor(INK);
      const text = latin1(textOf(el).replace(/\n$/, ''));
      ensure(Math.min(doc.heightOfString(text, { width: width - indent - 12 }) + 10, 200));
      doc.text(text, left + indent + 6, doc.y + 4, { width: width - indent - 12 });
      doc.x = left;
      gap(8);
    } else if (tag === 'table') table(el, indent);
    else if (tag === 'svg') svg(el, indent);
    else if (tag === 'hr') {
      ensure(12);
      doc.moveTo(left, doc.y + 4).lineTo(left + width, doc.y + 4).lineWidth(0.5).strokeColor(RULE).stroke();
      gap(12);
    } else if (tag === 'figcaption') {
      ensure(40);
      writeRuns(inlineRuns(el.children, { bold: true }), { indent, color: ACCENT, size: 11 });
      gap(4);
    } else if (tag === 'dt') {
      writeRuns(inlineRuns(el.children, { bold: true }), { indent });
    } else if (tag === 'dd') {
      writeRuns(inlineRuns(el.children), { indent: indent + 12, size: 9.5 });
      gap(4);
    } else if (tag === 'div' && hasClass(el, 'vc-math-display')) {
      writeRuns(inlineRuns(el.children), { indent, align: 'center' });
      gap(6);
    } else if (tag === 'div' && hasClass(el, 'vc-block-error')) {
      writeRuns(inlineRuns(el.children), { indent, color: '#9f1d1d' });
      gap(6);
    } else if (tag === 'figure' || tag === 'section') {
      gap(4);
      blocks(el.children, indent);
      gap(6);
    } else blocks(el.children, indent);
  }

  function table(el: HtmlElement, indent: number) {
    const caption = el.children.find((c): c is HtmlElement => typeof c !== 'string' && c.tag === 'caption');
    const rows: { cells: HtmlElement[]; head: boolean }[] = [];
    const collect = (node: HtmlElement, head: boolean) => {
      for (const c of node.children) {
        if (typeof c === 'string') continue;
        if (c.tag === 'tr') rows.push({ cells: c.children.filter((x): x is HtmlElement => typeof x !== 'string' && (x.tag === 'td' || x.tag === 'th')), head: head || c.children.some((x) => typeof x !== 'string' && x.tag === 'th' && node.tag === 'thead') });
        else if (c.tag === 'thead') collect(c, true);
        else if (c.tag === 'tbody' || c.tag === 'tfoot') collect(c, false);
      }
    };
    collect(el, false);
    if (!rows.length) return;
    const ncols = Math.max(...rows.map((r) => r.cells.length));
    const size = ncols > 7 ? 7.5 : ncols > 4 ? 8.5 : 9.5;
    const tableWidth = width - indent;
    const longestWord = (t: string) => Math.max(0, ...t.split(/\s+/).map((w) => w.length));
    const weights = Array.from({ length: ncols }, (_, i) => {
      const texts = rows.map((r) => textOf(r.cells[i] ?? '').trim());
      return Math.max(Math.min(Math.max(...texts.map((t) => t.length), 3), 30), ...texts.map(longestWord)) + 2;
    });
    const total = weights.reduce((a, b) => a + b, 0);
    const colW = weights.map((w) => (w / total) * tableWidth);
    if (caption) {
      ensure(40);
      writeRuns(inlineRuns(caption.children, { italic: true }), { indent, size: 9, color: MUTED });
      gap(2);
    }
    const header = rows.filter((r) => r.head);
    const drawRow = (r: { cells: HtmlElement[]; head: boolean }) => {
      const texts = r.cells.map((c) => textOf(c).replace(/\s+/g, ' ').trim());
      doc.font(r.head ? 'bold' : 'regular').fontSize(size);
      const h = Math.max(...texts.map((t, i) => doc.heightOfString(t || ' ', { width: colW[i]! - 6 }))) + 6;
      if (doc.y + h > bottom()) {
        doc.addPage();
        if (!r.head) header.forEach(drawRow);
        doc.font(r.head ? 'bold' : 'regular').fontSize(size);
      }
      const y = doc.y;
      let x = left + indent;
      texts.forEach((t, i) => {
        const numeric = hasClass(r.cells[i]!, 'vc-num') || r.cells[i]!.attrs.style?.includes('right');
        doc.fillColor(INK).text(t, x + 3, y + 3, { width: colW[i]! - 6, align: numeric ? 'right' : 'left' });
        x += colW[i]!;
      });
      doc.moveTo(left + indent, y + h).lineTo(left + indent + tableWidth, y + h).lineWidth(r.head ? 0.8 : 0.3).strokeColor(r.head ? MUTED : RULE).stroke();
      doc.y = y + h;
      doc.x = left;
    };
    rows.forEach(drawRow);
    gap(8);
  }

  function svg(el: HtmlElement, indent: number) {
    const box = (el.attrs.viewbox ?? `0 0 ${el.attrs.width ?? 600} ${el.attrs.height ?? 200}`).split(/[\s,]+/).map(Number);
    const [vx = 0, vy = 0, vw = 600, vh = 200] = box;
    if (!(vw > 0 && vh > 0)) return;
    const scale = Math.min((width - indent) / vw, 1);
    const h = vh * scale;
    ensure(h + 8);
    const y0 = doc.y;
    doc.save();
    doc.translate(left + indent, y0).scale(scale).translate(-vx, -vy);
    const colour = (v: string | undefined, fallback: string) => (v && /^#[0-9a-fA-F]{3,6}$/.test(v) ? v : fallback);
    const n = (v: string | undefined) => Number(v ?? 0) || 0;
    const draw = (node: HtmlElement) => {
      for (const c of node.children) {
        if (typeof c === 'string') continue;
        const a = c.attrs;
        if (c.tag === 'g') draw(c);
        else if (c.tag === 'line') {
          doc.moveTo(n(a.x1), n(a.y1)).lineTo(n(a.x2), n(a.y2)).lineWidth(n(a['stroke-width']) || 1).strokeColor(colour(a.stroke, INK));
          if (a['stroke-dasharray']) doc.dash(Number(a['stroke-dasharray'].split(/[\s,]+/)[0]) || 3, { space: Number(a['stroke-dasharray'].split(/[\s,]+/)[1]) || 3 });
          doc.stroke().undash();
        } else if (c.tag === 'circle') doc.circle(n(a.cx), n(a.cy), n(a.r)).fillColor(colour(a.fill, INK)).fill();
        else if (c.tag === 'rect') doc.rect(n(a.x), n(a.y), n(a.width), n(a.height)).fillColor(colour(a.fill, RULE)).fill();
        else if (c.tag === 'text') {
          const size = n(a['font-size']) || 11;
          const t = textOf(c);
          doc.font('regular').fontSize(size).fillColor(colour(a.fill, INK));
          const w = doc.widthOfString(t);
          const x = a['text-anchor'] === 'end' ? n(a.x) - w : a['text-anchor'] === 'middle' ? n(a.x) - w / 2 : n(a.x);
          doc.text(t, x, n(a.y) - size * 0.8, { lineBreak: false });
        }
      }
    };
    draw(el);
    doc.restore();
    doc.x = left;
    doc.y = y0 + h + 8;
  }

  // Title block.
  doc.font('bold').fontSize(20).fillColor(INK).text(input.title, left, doc.y, { width });
  gap(4);
  doc.font('regular').fontSize(9.5).fillColor(MUTED)
    .text(`Published ${input.publishedAt.slice(0, 10)} · version ${input.version}${input.corrections.length ? ` · last corrected ${input.corrections[input.corrections.length - 1]!.date.slice(0, 10)}` : ''}`, { width });
  doc.text(`Public page: ${input.publicUrl}`, { width, link: input.publicUrl });
  if (input.fictional) doc.font('bold').fillColor(CAUTION).text('Fictional demo data: the elections, polls and firms in this note are invented.', { width });
  gap(10);

  blocks(parseHtml(input.html).children);

  gap(8);
  ensure(80);
  doc.font('bold').fontSize(14).fillColor(INK).text('Data behind this note', left, doc.y, { width });
  gap(4);
  for (const a of input.audits) {
    ensure(40);
    doc.font('regular').fontSize(BODY).fillColor(INK).text(`Audit #${a.id} “${a.name}”, core ${a.coreVersion}, data hash:`, left, doc.y, { width });
    doc.font(MONO).fontSize(8.5).text(a.dataHash, { width });
    gap(4);
  }
  if (!input.audits.length) doc.font('regular').fontSize(BODY).text('This note cites no audit.', { width });
  if (input.corrections.length) {
    gap(8);
    ensure(60);
    doc.font('bold').fontSize(14).fillColor(INK).text('Corrections', left, doc.y, { width });
    gap(4);
    for (const c of input.corrections) {
      ensure(30);
      doc.font('bold').fontSize(BODY).text(`${c.date.slice(0, 10)} (version ${c.version}): `, left, doc.y, { width, continued: true }).font('regular').text(c.notice);
      gap(3);
    }
  }
  gap(8);
  ensure(80);
  doc.font('bold').fontSize(14).fillColor(INK).text('Reading these figures', left, doc.y, { width });
  gap(4);
  for (const c of input.cautions) {
    ensure(30);
    doc.font('regular').fontSize(9.5).fillColor(INK).text(`•  ${c}`, left, doc.y, { width, indent: 0 });
    gap(3);
  }

  const hash = input.audits[0]?.dataHash;
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const keep = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font('regular').fontSize(7.5).fillColor(MUTED)
      .text(`Veracast · published ${input.publishedAt.slice(0, 10)}${hash ? ` · data hash ${hash.slice(0, 16)}…` : ''} · page ${i + 1} of ${range.count}`, left, doc.page.height - 40, { width, align: 'center', lineBreak: false });
    doc.page.margins.bottom = keep;
  }
  doc.end();
  return done;
}

function normaliseRuns(runs: Run[]): Run[] {
  const out = runs.filter((r) => r.text.length > 0);
  while (out.length && !out[0]!.text.trim() && out[0]!.text !== '\n') out.shift();
  while (out.length && !out[out.length - 1]!.text.trim()) out.pop();
  if (out.length) {
    out[0] = { ...out[0]!, text: out[0]!.text.replace(/^ +/, '') };
    out[out.length - 1] = { ...out[out.length - 1]!, text: out[out.length - 1]!.text.replace(/ +$/, '') };
  }
  return out;
}

/** Only http(s) and mailto links survive into the PDF; relative ones are made absolute. */
function safeLink(href: string | undefined, base: string): string | undefined {
  if (!href) return undefined;
  try {
    const url = new URL(href, base);
    return ['http:', 'https:', 'mailto:'].includes(url.protocol) ? url.toString() : undefined;
  } catch {
    return undefined;
  }
}
