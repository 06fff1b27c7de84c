import { downloadBlob } from '../../../../lib/download';
import { chartPalette } from './palette';

/** A file name safe on every system: lower-case letters, digits and dashes. */
export function fileSlug(text: string): string {
  return (
    text
      .toLowerCase()
      .normalize('NFKD')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 80) || 'chart'
  );
}

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Height of the title band added above a saved chart. */
const TITLE_BAND = 28;

/**
 * A standalone copy of a chart's SVG: explicit size, a white background, the title written above
 * the chart and kept as `<title>`, a font family, and colours already resolved to plain values by
 * the chart palette.
 */
export function serializeChartSvg(svg: SVGSVGElement, title: string): { text: string; width: number; height: number } {
  const width = Number(svg.getAttribute('width')) || svg.getBoundingClientRect().width || 640;
  const chartHeight = Number(svg.getAttribute('height')) || svg.getBoundingClientRect().height || 320;
  const height = chartHeight + TITLE_BAND;
  const palette = chartPalette();
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const chart = document.createElementNS(SVG_NS, 'g');
  chart.setAttribute('transform', `translate(0, ${TITLE_BAND})`);
  while (copy.firstChild) chart.append(copy.firstChild);
  copy.setAttribute('xmlns', SVG_NS);
  copy.setAttribute('width', String(width));
  copy.setAttribute('height', String(height));
  copy.setAttribute('viewBox', `0 0 ${width} ${height}`);
  copy.setAttribute('font-family', 'Work Sans, Helvetica, Arial, sans-serif');
  copy.removeAttribute('class');
  const titleNode = document.createElementNS(SVG_NS, 'title');
  titleNode.textContent = title;
  const background = document.createElementNS(SVG_NS, 'rect');
  background.setAttribute('width', '100%');
  background.setAttribute('height', '100%');
  background.setAttribute('fill', palette.white);
  const heading = document.createElementNS(SVG_NS, 'text');
  heading.setAttribute('x', '12');
  heading.setAttribute('y', '19');
  heading.setAttribute('font-size', '14');
  heading.setAttribute('font-weight', '600');
  heading.setAttribute('fill', palette.text);
  heading.textContent = title;
  copy.append(titleNode, background, heading, chart);
  const text = `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}`;
  return { text, width, height };
}

export function downloadSvg(svg: SVGSVGElement, title: string, fileName: string): void {
  const { text } = serializeChartSvg(svg, title);
  downloadBlob(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }), fileName);
}

/** Draws the chart's SVG on a canvas at twice its size and saves it as PNG. */
export async function downloadPng(svg: SVGSVGElement, title: string, fileName: string): Promise<void> {
  const { text, width, height } = serializeChartSvg(svg, title);
  const scale = 2;
  const image = new Image();
  const loaded = new Promise<void>((resolve, reject) => {
    image.onload = () => resolve();
    image.onerror = () => reject(new Error('The chart could not be drawn as an image.'));
  });
  image.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(text)}`;
  await loaded;
  const canvas = document.createElement('canvas');
  canvas.width = Math.round(width * scale);
  canvas.height = Math.round(height * scale);
  const context = canvas.getContext('2d');
  if (!context) throw new Error('This browser cannot draw images.');
  context.fillStyle = chartPalette().white;
  context.fillRect(0, 0, canvas.width, canvas.height);
  context.drawImage(image, 0, 0, canvas.width, canvas.height);
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
  if (!blob) throw new Error('The image could not be saved.');
  downloadBlob(blob, fileName);
}
