import { downloadBlob } from '../../lib/download';

const INLINED = ['fill', 'fill-opacity', 'stroke', 'stroke-width', 'stroke-dasharray', 'opacity', 'font-family', 'font-size', 'font-weight', 'text-anchor'];

/** The chart as a self-contained SVG document: computed colours and fonts written inline. */
export function svgText(svg: SVGSVGElement): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const originals = [svg, ...svg.querySelectorAll('*')];
  const copies = [copy, ...copy.querySelectorAll('*')];
  originals.forEach((node, i) => {
    const target = copies[i];
    if (!target) return;
    const style = window.getComputedStyle(node);
    target.setAttribute('style', INLINED.map((name) => `${name}:${style.getPropertyValue(name)}`).join(';'));
    target.removeAttribute('class');
  });
  const box = svg.getBoundingClientRect();
  copy.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  copy.setAttribute('width', String(Math.round(box.width)));
  copy.setAttribute('height', String(Math.round(box.height)));
  return new XMLSerializer().serializeToString(copy);
}

export function saveSvg(svg: SVGSVGElement, filename: string): void {
  downloadBlob(new Blob([svgText(svg)], { type: 'image/svg+xml' }), filename);
}

/** Draws the SVG on a white canvas at twice its size and saves it as PNG. */
export async function savePng(svg: SVGSVGElement, filename: string): Promise<void> {
  const box = svg.getBoundingClientRect();
  const width = Math.max(1, Math.round(box.width));
  const height = Math.max(1, Math.round(box.height));
  const url = URL.createObjectURL(new Blob([svgText(svg)], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The chart could not be turned into an image.'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = width * 2;
    canvas.height = height * 2;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw the image.');
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
