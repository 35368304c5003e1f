import { neutraliseCsvCell } from '@ladderwright/shared/parts';

/** One column of a chart's data file: the row key and its header text (name and SI unit). */
export interface CsvColumn {
  key: string;
  header: string;
}

const quoted = (text: string) => (/[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text);

/**
 * The rows of a chart as CSV (RFC 4180: comma separated, CRLF line ends, quotes doubled): a header line,
 * then one line per row with every number in full precision in SI base units; a missing value is an empty cell.
 */
export function chartCsv(columns: readonly CsvColumn[], rows: readonly Readonly<Record<string, unknown>>[]): string {
  const lines = [columns.map((column) => quoted(neutraliseCsvCell(column.header))).join(',')];
  for (const row of rows) {
    lines.push(
      columns
        .map((column) => {
          const value = row[column.key];
          return typeof value === 'number' && Number.isFinite(value) ? String(value) : '';
        })
        .join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** A file name from a chart title: lower case, words joined by hyphens, e.g. "output-vs-load-current". */
export function chartFileName(title: string): string {
  const slug = title
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return slug || 'chart';
}

const paintAttributes = ['fill', 'stroke', 'color', 'stop-color'] as const;

/**
 * A standalone SVG document of a drawn chart: the page's CSS variables and `currentColor` resolved to the
 * colours on screen, the font set on the root, a white background, and the size fixed in pixels.
 */
export function standaloneSvg(svg: SVGSVGElement, widthPx: number, heightPx: number): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const originals = [svg, ...svg.querySelectorAll('*')];
  const copies = [copy, ...copy.querySelectorAll('*')];
  originals.forEach((original, i) => {
    const target = copies[i];
    if (!target) return;
    const style = getComputedStyle(original);
    for (const name of paintAttributes) {
      const given = target.getAttribute(name);
      if (given && (given.includes('var(') || given === 'currentColor')) {
        const resolved = style.getPropertyValue(name === 'color' ? 'color' : name);
        if (resolved) target.setAttribute(name, resolved);
      }
    }
  });
  copy.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  copy.setAttribute('width', String(widthPx));
  copy.setAttribute('height', String(heightPx));
  copy.setAttribute('viewBox', `0 0 ${widthPx} ${heightPx}`);
  copy.setAttribute('font-family', getComputedStyle(svg).fontFamily || 'sans-serif');
  copy.removeAttribute('style');
  const background = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
  background.setAttribute('width', '100%');
  background.setAttribute('height', '100%');
  background.setAttribute('fill', '#ffffff');
  copy.insertBefore(background, copy.firstChild);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}`;
}

/** Rasterises an SVG document at `scale` device pixels per CSS pixel into a PNG. */
export async function svgToPng(markup: string, widthPx: number, heightPx: number, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([markup], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.decoding = 'sync';
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('the chart could not be drawn as an image'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(widthPx * scale);
    canvas.height = Math.round(heightPx * scale);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('this browser cannot draw a canvas');
    context.scale(scale, scale);
    context.drawImage(image, 0, 0, widthPx, heightPx);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('no PNG was produced'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Hands a file to the browser's download. */
export function downloadFile(content: Blob | string, fileName: string, type: string): void {
  const blob = typeof content === 'string' ? new Blob([content], { type }) : content;
  const url = URL.createObjectURL(blob);
  const anchor = document.createElement('a');
  anchor.href = url;
  anchor.download = fileName;
  anchor.style.display = 'none';
  document.body.append(anchor);
  anchor.click();
  anchor.remove();
  // Give the download a moment to start before the address goes.
  setTimeout(() => URL.revokeObjectURL(url), 1_000);
}
