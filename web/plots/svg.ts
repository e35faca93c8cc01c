/**
 * A standalone SVG drawing of a PlotSpec over given x and y ranges: axes
 * with round ticks, one polyline (or markers) per series, the marks, a
 * legend. Pure: returns the SVG text.
 */
import type { Mark, PlotSpec } from './spec.js';
import { niceTicks } from './ticks.js';

export interface SvgOptions {
  xRange: [number, number];
  yRange: [number, number];
  /** Default 900 × 420 user units. */
  width?: number;
  height?: number;
}

const MARGIN = { left: 72, right: 20, top: 34, bottom: 52 };

function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function tickText(value: number): string {
  return Math.abs(value) >= 1e5 || (Math.abs(value) < 1e-3 && value !== 0) ? value.toExponential(1) : String(value);
}

export function svgFromSpec(spec: PlotSpec, options: SvgOptions): string {
  const { xRange, yRange, width = 900, height = 420 } = options;
  const plotW = width - MARGIN.left - MARGIN.right;
  const plotH = height - MARGIN.top - MARGIN.bottom;
  const [x0, x1] = xRange;
  const [y0, y1] = yRange;
  const sx = (x: number): number => MARGIN.left + ((x - x0) / (x1 - x0)) * plotW;
  const sy = (y: number): number => MARGIN.top + (1 - (y - y0) / (y1 - y0)) * plotH;
  const f = (v: number): string => v.toFixed(1);
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="system-ui, sans-serif" font-size="12">`);
  out.push(`<rect width="${width}" height="${height}" fill="#fff"/>`);
  out.push(`<text x="${MARGIN.left}" y="20" font-size="14" font-weight="600">${escapeXml(spec.title)}</text>`);
  out.push(`<defs><clipPath id="plot-area"><rect x="${MARGIN.left}" y="${MARGIN.top}" width="${plotW}" height="${plotH}"/></clipPath></defs>`);

  const xTicks = spec.xTicks ?? niceTicks(x0, x1, 8).map((value) => ({ value, label: tickText(value) }));
  for (const t of xTicks) {
    if (spec.xTicks === undefined) out.push(`<line x1="${f(sx(t.value))}" x2="${f(sx(t.value))}" y1="${MARGIN.top}" y2="${MARGIN.top + plotH}" stroke="#000" stroke-opacity="0.09"/>`);
    out.push(`<text x="${f(sx(t.value))}" y="${MARGIN.top + plotH + 16}" text-anchor="middle">${escapeXml(t.label)}</text>`);
  }
  for (const t of niceTicks(y0, y1, 6)) {
    out.push(`<line x1="${MARGIN.left}" x2="${MARGIN.left + plotW}" y1="${f(sy(t))}" y2="${f(sy(t))}" stroke="#000" stroke-opacity="0.09"/>`);
    out.push(`<text x="${MARGIN.left - 6}" y="${f(sy(t) + 4)}" text-anchor="end">${tickText(t)}</text>`);
  }
  out.push(`<rect x="${MARGIN.left}" y="${MARGIN.top}" width="${plotW}" height="${plotH}" fill="none" stroke="#333"/>`);
  out.push(`<text x="${MARGIN.left + plotW / 2}" y="${height - 12}" text-anchor="middle">${escapeXml(spec.xLabel)}</text>`);
  out.push(`<text transform="translate(16 ${MARGIN.top + plotH / 2}) rotate(-90)" text-anchor="middle">${escapeXml(spec.yLabel)}</text>`);

  out.push('<g clip-path="url(#plot-area)">');
  for (const mark of spec.marks) if (mark.kind === 'shade') out.push(markSvg(mark, sx, sy, MARGIN.top, plotH));
  spec.series.forEach((series, i) => {
    const ys = spec.ys[i] ?? [];
    if (series.pointsOnly === true) {
      spec.x.forEach((x, k) => {
        const y = ys[k];
        if (y !== null && y !== undefined && Number.isFinite(y)) out.push(`<circle cx="${f(sx(x))}" cy="${f(sy(y))}" r="3.5" fill="${series.color}"/>`);
      });
      return;
    }
    const segments: string[][] = [[]];
    spec.x.forEach((x, k) => {
      const y = ys[k];
      if (y === null || y === undefined || !Number.isFinite(y)) segments.push([]);
      else segments[segments.length - 1]!.push(`${f(sx(x))},${f(sy(y))}`);
    });
    const dash = series.dash === undefined ? '' : ` stroke-dasharray="${series.dash.join(' ')}"`;
    for (const points of segments) {
      if (points.length > 1) out.push(`<polyline fill="none" stroke="${series.color}" stroke-width="${series.width}"${dash} points="${points.join(' ')}"/>`);
    }
  });
  for (const mark of spec.marks) if (mark.kind !== 'shade') out.push(markSvg(mark, sx, sy, MARGIN.top, plotH));
  out.push('</g>');

  let legendX = MARGIN.left + plotW;
  const legend = spec.series.filter((s) => s.quiet !== true).reverse();
  for (const series of legend) {
    const label = escapeXml(series.label);
    legendX -= 36 + series.label.length * 7.2;
    out.push(`<line x1="${f(legendX)}" x2="${f(legendX + 18)}" y1="16" y2="16" stroke="${series.color}" stroke-width="2.5"/>`);
    out.push(`<text x="${f(legendX + 22)}" y="20">${label}</text>`);
  }
  out.push('</svg>');
  return out.join('\n');
}

function markSvg(mark: Mark, sx: (x: number) => number, sy: (y: number) => number, top: number, plotH: number): string {
  const f = (v: number): string => v.toFixed(1);
  switch (mark.kind) {
    case 'shade': {
      const a = sx(mark.from);
      const b = sx(mark.to);
      return `<rect x="${f(Math.min(a, b))}" y="${top}" width="${f(Math.abs(b - a))}" height="${plotH}" fill="${mark.color}"/>`;
    }
    case 'vline': {
      const x = f(sx(mark.x));
      const caption = mark.text === undefined ? '' : `<text x="${f(sx(mark.x) + 4)}" y="${top + 14}" fill="${mark.color}">${escapeXml(mark.text)}</text>`;
      return `<line x1="${x}" x2="${x}" y1="${top}" y2="${top + plotH}" stroke="${mark.color}" stroke-width="1.5" stroke-dasharray="${(mark.dash ?? [6, 4]).join(' ')}"/>${caption}`;
    }
    case 'errorbar': {
      const x = sx(mark.x);
      const [a, b] = [sy(mark.low), sy(mark.high)];
      return `<path d="M${f(x)} ${f(a)}V${f(b)}M${f(x - 5)} ${f(a)}h10M${f(x - 5)} ${f(b)}h10" stroke="${mark.color}" stroke-width="1.5" fill="none"/>`;
    }
    case 'point': {
      const caption = mark.text === undefined ? '' : `<text x="${f(sx(mark.x) + 7)}" y="${f(sy(mark.y) - 3)}">${escapeXml(mark.text)}</text>`;
      return `<circle cx="${f(sx(mark.x))}" cy="${f(sy(mark.y))}" r="4.5" fill="${mark.color}" stroke="#fff" stroke-width="1.5"/>${caption}`;
    }
    case 'text': {
      const anchor = mark.align === 'left' ? 'start' : mark.align === 'right' ? 'end' : 'middle';
      return `<text x="${f(sx(mark.x))}" y="${f(sy(mark.y) - (mark.rise ?? 0))}" text-anchor="${anchor}" fill="${mark.color}">${escapeXml(mark.text)}</text>`;
    }
  }
}
