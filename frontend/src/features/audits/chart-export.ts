/** Downloads of a chart as a picture (SVG, PNG), made in the browser. */

import { downloadBlob } from '../../lib/download';

/** A standalone SVG document of a chart, with its size and a white background. */
export function serializeSvg(svg: SVGSVGElement): { text: string; width: number; height: number } {
  const box = svg.getBoundingClientRect();
  const width = Math.round(Number(svg.getAttribute('width')) || box.width || 640);
  const height = Math.round(Number(svg.getAttribute('height')) || box.height || 320);
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  clone.setAttribute('width', String(width));
  clone.setAttribute('height', String(height));
  clone.setAttribute('viewBox', `0 0 ${width} ${height}`);
  const fontFamily = getComputedStyle(svg).fontFamily;
  if (fontFamily) clone.setAttribute('font-family', fontFamily);
  const background = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
  background.setAttribute('width', '100%');
  background.setAttribute('height', '100%');
  background.setAttribute('fill', 'white');
  clone.insertBefore(background, clone.firstChild);
  return { text: new XMLSerializer().serializeToString(clone), width, height };
}

export function downloadSvg(svg: SVGSVGElement, filename: string): void {
  const { text } = serializeSvg(svg);
  downloadBlob(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }), filename);
}

/** Draws the SVG on a canvas at twice its size and downloads it as PNG. */
export async function downloadPng(svg: SVGSVGElement, filename: string, scale = 2): Promise<void> {
  const { text, width, height } = serializeSvg(svg);
  const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The chart could not be drawn as an image.'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = width * scale;
    canvas.height = height * scale;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw images.');
    context.scale(scale, scale);
    context.drawImage(image, 0, 0, width, height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The chart could not be saved as PNG.');
    downloadBlob(blob, filename);
  } finally {
    URL.revokeObjectURL(url);
  }
}
