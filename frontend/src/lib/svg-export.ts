import { downloadBlob } from './download';

/** Saving a chart drawn as SVG on the page as an SVG or PNG file, made in the browser. */

const SVG_NS = 'http://www.w3.org/2000/svg';
const SVG_TYPE = 'image/svg+xml;charset=utf-8';

/** Style properties that may come from the page's style sheet and are written onto each element. */
const STYLE_PROPERTIES = [
  'fill',
  'fill-opacity',
  'stroke',
  'stroke-width',
  'stroke-dasharray',
  'stroke-opacity',
  'opacity',
  'font-family',
  'font-size',
  'font-weight',
  'text-anchor',
  'dominant-baseline',
  'visibility',
  'overflow',
] as const;

export interface StandaloneSvg {
  /** A detached copy of the chart; the chart on the page is not touched. */
  node: SVGSVGElement;
  width: number;
  height: number;
}

export interface StandaloneSvgOptions {
  /** Colour of a rectangle drawn behind the chart; null for none. Default white. */
  background?: string | null;
}

/** The chart's size: its width and height attributes, else its box on the page, else 640 × 320. */
function sizeOf(svg: SVGSVGElement): { width: number; height: number } {
  const box = svg.getBoundingClientRect();
  return {
    width: Math.round(Number(svg.getAttribute('width')) || box.width || 640),
    height: Math.round(Number(svg.getAttribute('height')) || box.height || 320),
  };
}

/**
 * A standalone copy of a chart's SVG: the colours and fonts that come from the page's style sheet
 * are written onto each element (so the file looks the same outside the app), classes are
 * dropped, and the copy gets the SVG namespace, an explicit size and view box, and a background.
 */
export function standaloneSvg(svg: SVGSVGElement, { background = '#ffffff' }: StandaloneSvgOptions = {}): StandaloneSvg {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  const sources = [svg, ...Array.from(svg.querySelectorAll('*'))];
  const targets = [clone, ...Array.from(clone.querySelectorAll('*'))];
  sources.forEach((source, i) => {
    const target = targets[i];
    if (!(target instanceof Element)) return;
    const computed = getComputedStyle(source);
    const declarations = STYLE_PROPERTIES.map((p) => [p, computed.getPropertyValue(p)] as const)
      .filter(([, v]) => v !== '')
      .map(([p, v]) => `${p}:${v}`);
    const own = target.getAttribute('style');
    if (declarations.length > 0) target.setAttribute('style', [own, ...declarations].filter(Boolean).join(';'));
    target.removeAttribute('class');
  });
  const { width, height } = sizeOf(svg);
  clone.setAttribute('xmlns', SVG_NS);
  clone.setAttribute('width', String(width));
  clone.setAttribute('height', String(height));
  clone.setAttribute('viewBox', svg.getAttribute('viewBox') ?? `0 0 ${width} ${height}`);
  if (background) {
    const rect = document.createElementNS(SVG_NS, 'rect');
    rect.setAttribute('width', '100%');
    rect.setAttribute('height', '100%');
    rect.setAttribute('fill', background);
    clone.insertBefore(rect, clone.firstChild);
  }
  return { node: clone, width, height };
}

/** An SVG element as the text of an SVG file. */
export function svgFileText(node: SVGSVGElement): string {
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(node)}`;
}

/** The chart as the text of a standalone SVG file, with its size. */
export function serializeSvg(svg: SVGSVGElement): { text: string; width: number; height: number } {
  const { node, width, height } = standaloneSvg(svg);
  return { text: svgFileText(node), width, height };
}

/** Draws SVG file text on a white canvas at `scale` times its size and answers the PNG. */
export async function svgTextToPng(text: string, width: number, height: number, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([text], { type: SVG_TYPE }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The chart could not be drawn as an image.'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.max(1, Math.round(width * scale));
    canvas.height = Math.max(1, Math.round(height * scale));
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw images.');
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The image could not be made.');
    return blob;
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Offers SVG file text as a download. */
export function downloadSvgText(text: string, fileName: string): void {
  downloadBlob(new Blob([text], { type: SVG_TYPE }), fileName);
}

/** Offers SVG file text as a PNG download at twice its size. */
export async function downloadSvgTextAsPng(text: string, width: number, height: number, fileName: string): Promise<void> {
  downloadBlob(await svgTextToPng(text, width, height), fileName);
}

/** Offers the chart as an SVG file. */
export function downloadSvg(svg: SVGSVGElement, fileName: string): void {
  downloadSvgText(serializeSvg(svg).text, fileName);
}

/** Offers the chart as a PNG file at twice its size. */
export async function downloadPng(svg: SVGSVGElement, fileName: string): Promise<void> {
  const { text, width, height } = serializeSvg(svg);
  await downloadSvgTextAsPng(text, width, height, fileName);
}
