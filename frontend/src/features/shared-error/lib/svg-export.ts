import { downloadBlob } from '../../../lib/download';

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

/**
 * A standalone copy of a chart's SVG: the colours and fonts that come from the page's style
 * sheet are written onto each element, so the file looks the same outside the app.
 */
export function serializeSvg(svg: SVGSVGElement): string {
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
  const { width, height } = svg.getBoundingClientRect();
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  if (width > 0 && height > 0) {
    clone.setAttribute('width', String(Math.round(width)));
    clone.setAttribute('height', String(Math.round(height)));
    if (!clone.getAttribute('viewBox')) clone.setAttribute('viewBox', `0 0 ${Math.round(width)} ${Math.round(height)}`);
  }
  const background = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
  background.setAttribute('width', '100%');
  background.setAttribute('height', '100%');
  background.setAttribute('fill', '#ffffff');
  clone.insertBefore(background, clone.firstChild);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(clone)}`;
}

export function downloadSvg(svg: SVGSVGElement, filename: string): void {
  downloadBlob(new Blob([serializeSvg(svg)], { type: 'image/svg+xml;charset=utf-8' }), filename);
}

/** Draws the serialised SVG on a canvas at twice its size and offers it as a PNG. */
export async function downloadPng(svg: SVGSVGElement, filename: string): Promise<void> {
  const text = serializeSvg(svg);
  const { width, height } = svg.getBoundingClientRect();
  const w = Math.max(1, Math.round(width));
  const h = Math.max(1, Math.round(height));
  const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The chart could not be drawn as an image.'));
      image.src = url;
    });
    const scale = 2;
    const canvas = document.createElement('canvas');
    canvas.width = w * scale;
    canvas.height = h * scale;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw images.');
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The image could not be made.');
    downloadBlob(blob, filename);
  } finally {
    URL.revokeObjectURL(url);
  }
}
