/** Downloads of a chart (SVG, PNG) and of its data (CSV), all made in the browser. */

export type CsvCell = string | number | boolean | null | undefined;

/**
 * One CSV cell: a text that a spreadsheet would run as a formula (starting with = + - @, or a tab
 * or carriage return) gets a leading apostrophe; numbers stay numbers; quotes are doubled.
 */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  let text = String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export interface CsvColumn<Row> {
  header: string;
  value: (row: Row) => CsvCell;
}

/** A CSV text with a header row and CRLF line ends. */
export function toCsv<Row>(columns: readonly CsvColumn<Row>[], rows: readonly Row[]): string {
  const lines = [columns.map((column) => csvCell(column.header)).join(',')];
  for (const row of rows) lines.push(columns.map((column) => csvCell(column.value(row))).join(','));
  return `${lines.join('\r\n')}\r\n`;
}

export function downloadBlob(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadCsv(text: string, filename: string): void {
  // The byte-order mark lets spreadsheets read the file as UTF-8.
  downloadBlob(new Blob(['\uFEFF', text], { type: 'text/csv;charset=utf-8' }), filename);
}

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
