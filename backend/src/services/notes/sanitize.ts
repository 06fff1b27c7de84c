import sanitizeHtml from 'sanitize-html';

const MATHML = [
  'math', 'semantics', 'annotation', 'mrow', 'mi', 'mo', 'mn', 'ms', 'mtext', 'mspace', 'msup', 'msub', 'msubsup', 'mfrac', 'msqrt', 'mroot',
  'mover', 'munder', 'munderover', 'mtable', 'mtr', 'mtd', 'menclose', 'mpadded', 'mphantom', 'mstyle', 'merror',
];
const MATHML_ATTRS = [
  'xmlns', 'display', 'encoding', 'mathvariant', 'stretchy', 'fence', 'separator', 'lspace', 'rspace', 'width', 'height', 'depth', 'accent', 'accentunder',
  'movablelimits', 'columnalign', 'rowspacing', 'columnspacing', 'scriptlevel', 'displaystyle', 'linethickness', 'minsize', 'maxsize', 'symmetric', 'notation', 'mathcolor',
];
const SVG = ['svg', 'g', 'path', 'line', 'circle', 'rect', 'text', 'title'];
const SVG_ATTRS = [
  'xmlns', 'viewbox', 'width', 'height', 'preserveaspectratio', 'role', 'aria-label', 'd', 'x', 'y', 'x1', 'y1', 'x2', 'y2', 'cx', 'cy', 'r',
  'fill', 'stroke', 'stroke-width', 'stroke-dasharray', 'font-size', 'text-anchor', 'class',
];
// KaTeX positions glyphs with these inline properties; each value is a length, a number or a colour.
const LENGTH = /^-?(\d+(\.\d+)?|\.\d+)(em|ex|px|pt|%)?$/;
const KATEX_STYLES = Object.fromEntries(
  ['height', 'vertical-align', 'margin-right', 'margin-left', 'top', 'bottom', 'left', 'width', 'min-width', 'padding-left', 'border-bottom-width', 'border-right-width', 'border-top-width', 'margin-top']
    .map((p) => [p, [LENGTH]]),
);

/**
 * The allow-list applied to every rendered note: Markdown's elements, tables, KaTeX's spans and
 * MathML, and the SVG of our charts. No script, style or iframe element, no `on*` attribute (none
 * is listed), links only to http(s), mailto or relative addresses, and no images.
 */
const OPTIONS: sanitizeHtml.IOptions = {
  allowedTags: [
    'h1', 'h2', 'h3', 'h4', 'h5', 'h6', 'p', 'br', 'hr', 'blockquote', 'pre', 'code', 'em', 'strong', 's', 'del', 'a', 'ul', 'ol', 'li',
    'table', 'caption', 'thead', 'tbody', 'tr', 'th', 'td', 'figure', 'figcaption', 'section', 'div', 'span', 'dl', 'dt', 'dd', 'cite', 'sup', 'sub',
    ...MATHML, ...SVG,
  ],
  allowedAttributes: {
    a: ['href', 'title'],
    ol: ['start'],
    th: ['style', 'class'],
    td: ['style', 'class'],
    code: ['class'],
    span: ['class', 'style', 'aria-hidden', 'title'],
    div: ['class', 'role'],
    p: ['class'],
    figure: ['class'],
    section: ['class'],
    dl: ['class'],
    ul: ['class'],
    table: ['class'],
    ...Object.fromEntries(MATHML.map((t) => [t, MATHML_ATTRS])),
    ...Object.fromEntries(SVG.map((t) => [t, SVG_ATTRS])),
  },
  allowedStyles: {
    span: { ...KATEX_STYLES, color: [/^#[0-9a-fA-F]{3,6}$/, /^[a-z]+$/] },
    th: { 'text-align': [/^(left|right|center)$/] },
    td: { 'text-align': [/^(left|right|center)$/] },
  },
  allowedClasses: {
    code: [/^language-[\w-]+$/, 'vc-tex-error'],
    '*': [/^vc-[\w-]+$/, /^katex[\w-]*$/, /^[a-z]{1,12}[\w-]*$/],
  },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: {},
  allowedSchemesAppliedToAttributes: ['href'],
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
  enforceHtmlBoundary: false,
  parser: { lowerCaseAttributeNames: true },
};

/** Sanitises rendered note HTML with the allow-list above. */
export function sanitizeNoteHtml(html: string): string {
  return sanitizeHtml(html, OPTIONS);
}
