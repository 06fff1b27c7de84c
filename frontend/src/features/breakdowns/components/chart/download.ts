import { downloadSvgText, downloadSvgTextAsPng, standaloneSvg, svgFileText } from '../../../../lib/svg-export';
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
 * A standalone copy of a chart's SVG (see `standaloneSvg`) with the title written in a band above
 * the chart and kept as `<title>`, on the chart palette's white.
 */
export function serializeChartSvg(svg: SVGSVGElement, title: string): { text: string; width: number; height: number } {
  const { node: copy, width, height: chartHeight } = standaloneSvg(svg, { background: null });
  const height = chartHeight + TITLE_BAND;
  const palette = chartPalette();
  const chart = document.createElementNS(SVG_NS, 'g');
  chart.setAttribute('transform', `translate(0, ${TITLE_BAND})`);
  while (copy.firstChild) chart.append(copy.firstChild);
  copy.setAttribute('height', String(height));
  copy.setAttribute('viewBox', `0 0 ${width} ${height}`);
  copy.setAttribute('font-family', 'Work Sans, Helvetica, Arial, sans-serif');
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
  return { text: svgFileText(copy), width, height };
}

export function downloadSvg(svg: SVGSVGElement, title: string, fileName: string): void {
  downloadSvgText(serializeChartSvg(svg, title).text, fileName);
}

/** Draws the chart with its title on a canvas at twice its size and saves it as PNG. */
export async function downloadPng(svg: SVGSVGElement, title: string, fileName: string): Promise<void> {
  const { text, width, height } = serializeChartSvg(svg, title);
  await downloadSvgTextAsPng(text, width, height, fileName);
}
