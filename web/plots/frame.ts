/**
 * One uPlot chart built from a PlotSpec: drag on the plot to zoom in x,
 * double-click or "Reset zoom" to go back, marks drawn on the canvas, width
 * following its container, and a click handler for picking a position.
 * update() swaps in a new spec on the same chart (same DOM node), keeping
 * the x range the user zoomed to; only series whose looks changed are
 * replaced, and only a different axis (unit, ticks, fixed range) needs a
 * new frame.
 */
import uPlot from 'uplot';
import type { Mark, PlotSpec } from './spec.js';
import { dataRange } from './spec.js';

export interface PlotFrameOptions {
  /** CSS pixels; default 320. */
  height?: number;
  /** Called with the x value (plot units) of a click that was not a drag. */
  onPick?: (x: number) => void;
}

const FONT = '12px system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", sans-serif';
const AXIS_STROKE = '#333';
const GRID_STROKE = 'rgba(0, 0, 0, 0.09)';

export class PlotFrame {
  spec: PlotSpec;
  readonly plot: uPlot;
  private readonly observer: ResizeObserver;
  private readonly container: HTMLElement;
  private yRangeNow: [number, number];
  private onPick: ((x: number) => void) | undefined;
  /** The x range shown when not zoomed (what uPlot chose for the whole data). */
  private fullX: [number, number];

  constructor(container: HTMLElement, spec: PlotSpec, options: PlotFrameOptions = {}) {
    const { height = 320, onPick } = options;
    this.spec = spec;
    this.container = container;
    this.onPick = onPick;
    container.replaceChildren();
    this.yRangeNow = yRangeOf(spec);
    const opts: uPlot.Options = {
      width: Math.max(320, container.clientWidth || 640),
      height,
      scales: {
        // The range functions read the frame's current spec, so update() can change them.
        x: spec.xRange === undefined ? { time: false } : { time: false, auto: false, range: () => this.spec.xRange ?? [0, 1] },
        y: { auto: false, range: () => this.yRangeNow },
      },
      axes: [
        {
          label: spec.xLabel, stroke: AXIS_STROKE, font: FONT, labelFont: FONT, grid: { stroke: GRID_STROKE },
          ...(spec.xTicks === undefined
            ? {}
            : { splits: () => spec.xTicks!.map((t) => t.value), values: () => spec.xTicks!.map((t) => t.label), grid: { show: false } }),
        },
        { label: spec.yLabel, stroke: AXIS_STROKE, font: FONT, labelFont: FONT, grid: { stroke: GRID_STROKE }, size: 64 },
      ],
      series: [
        { label: spec.xLabel, value: (_u, v) => (v === null ? '—' : v.toFixed(2)) },
        ...spec.series.map(uPlotSeries),
      ],
      legend: { show: spec.series.some((s) => s.quiet !== true) },
      cursor: { drag: { x: true, y: false, setScale: true } },
      hooks: { draw: [(u: uPlot) => drawMarks(u, this.spec.marks), (u: uPlot) => this.recordDraw(u)] },
    };
    this.plot = new uPlot(opts, alignedData(spec), container);
    this.fullX = fullXOf(spec);
    hideQuietLegendRows(this.plot, spec);
    this.bindPick();
    this.observer = new ResizeObserver(() => {
      const width = Math.max(320, this.container.clientWidth);
      if (Math.abs(width - this.plot.width) > 2) this.plot.setSize({ width, height });
    });
    this.observer.observe(container);
  }

  /**
   * Shows `spec` on this chart, keeping the user's x zoom (clipped to the
   * new data). Returns false, changing nothing, when the spec has another
   * x axis (label, ticks, fixed range) or legend: the caller then builds a
   * new frame. `onPick` replaces the click handler.
   */
  update(spec: PlotSpec, onPick?: (x: number) => void): boolean {
    if (!sameAxes(this.spec, spec)) return false;
    const shown = this.xRange();
    const zoomed = this.isZoomed();
    const old = this.spec;
    this.spec = spec;
    this.onPick = onPick;
    this.yRangeNow = yRangeOf(spec);
    // Replace only the series whose looks differ; uPlot index 0 is x.
    const common = Math.min(old.series.length, spec.series.length);
    for (let i = 0; i < common; i++) {
      if (seriesKey(old.series[i]!) === seriesKey(spec.series[i]!)) continue;
      this.plot.delSeries(i + 1);
      this.plot.addSeries(uPlotSeries(spec.series[i]!), i + 1);
    }
    for (let i = old.series.length; i > spec.series.length; i--) this.plot.delSeries(i);
    for (let i = common; i < spec.series.length; i++) this.plot.addSeries(uPlotSeries(spec.series[i]!), i + 1);
    // uPlot applies scales in a microtask, so the full range is taken from the spec, not read back.
    this.fullX = fullXOf(spec);
    this.plot.setData(alignedData(spec), true);
    this.plot.setScale('y', { min: this.yRangeNow[0], max: this.yRangeNow[1] });
    if (zoomed) {
      const lo = Math.max(shown[0], this.fullX[0]);
      const hi = Math.min(shown[1], this.fullX[1]);
      if (hi > lo) this.plot.setScale('x', { min: lo, max: hi });
    }
    hideQuietLegendRows(this.plot, spec);
    return true;
  }

  /** Back to the full x range of the data. */
  resetZoom(): void {
    const [min, max] = fullXOf(this.spec);
    if (max > min) this.plot.setScale('x', { min, max });
  }

  /** Whether the user has zoomed in x. */
  isZoomed(): boolean {
    return !sameRange(this.xRange(), this.fullX);
  }

  /** Current visible x range. */
  xRange(): [number, number] {
    const scale = this.plot.scales['x'];
    return [scale?.min ?? this.spec.x[0] ?? 0, scale?.max ?? this.spec.x[this.spec.x.length - 1] ?? 1];
  }

  yRange(): [number, number] {
    const scale = this.plot.scales['y'];
    return [scale?.min ?? 0, scale?.max ?? 1];
  }

  /** The drawn canvas (plot, axes, marks) on a white background, as a PNG data URL. */
  toPng(): string {
    const source = this.plot.ctx.canvas;
    const canvas = document.createElement('canvas');
    canvas.width = source.width;
    canvas.height = source.height;
    const ctx = canvas.getContext('2d');
    if (ctx === null) return source.toDataURL('image/png');
    ctx.fillStyle = '#fff';
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(source, 0, 0);
    return canvas.toDataURL('image/png');
  }

  destroy(): void {
    this.observer.disconnect();
    this.plot.destroy();
  }

  /**
   * Writes the shown x range and a draw count on the container
   * (data-x-range="min max", data-draws, counting on across rebuilt charts),
   * so a page test can wait for a redraw and read the zoom without reaching
   * into uPlot.
   */
  private recordDraw(u: uPlot): void {
    const scale = u.scales['x'];
    const dataset = this.container.dataset;
    dataset['xRange'] = `${scale?.min ?? ''} ${scale?.max ?? ''}`;
    dataset['draws'] = String(Number(dataset['draws'] ?? '0') + 1);
  }

  private bindPick(): void {
    let downAt: { x: number; y: number } | null = null;
    const over = this.plot.over;
    over.addEventListener('mousedown', (event) => {
      downAt = { x: event.clientX, y: event.clientY };
    });
    over.addEventListener('mouseup', (event) => {
      if (downAt === null) return;
      const moved = Math.hypot(event.clientX - downAt.x, event.clientY - downAt.y);
      downAt = null;
      // A drag is a zoom, not a pick.
      if (moved > 3 || this.onPick === undefined) return;
      const rect = over.getBoundingClientRect();
      this.onPick(this.plot.posToVal(event.clientX - rect.left, 'x'));
    });
  }
}

function uPlotSeries(s: PlotSpec['series'][number]): uPlot.Series {
  const series: uPlot.Series = {
    label: s.label,
    stroke: s.color,
    width: s.width,
    show: true,
    value: (_u: uPlot, v: number | null) => (v === null ? '—' : v.toPrecision(4)),
  };
  if (s.dash !== undefined) series.dash = s.dash;
  if (s.pointsOnly === true) {
    series.paths = () => null;
    series.points = { show: true, size: 7, stroke: s.color, fill: s.color };
  } else {
    series.points = { show: false };
  }
  return series;
}

function alignedData(spec: PlotSpec): uPlot.AlignedData {
  return [spec.x, ...spec.ys] as unknown as uPlot.AlignedData;
}

/** The x range uPlot shows unzoomed: the fixed range, else first to last x (uPlot's numeric x scale). */
function fullXOf(spec: PlotSpec): [number, number] {
  if (spec.xRange !== undefined) return spec.xRange;
  return [spec.x[0] ?? 0, spec.x[spec.x.length - 1] ?? 1];
}

function yRangeOf(spec: PlotSpec): [number, number] {
  return spec.yRange ?? padded(dataRange(spec.ys));
}

/** Everything about a series that uPlot fixes when the series is added. */
function seriesKey(s: PlotSpec['series'][number]): string {
  return JSON.stringify([s.label, s.color, s.width, s.dash ?? null, s.pointsOnly === true, s.quiet === true]);
}

/** Whether two specs share the x axis and legend that uPlot fixes when the chart is built. */
export function sameAxes(a: PlotSpec, b: PlotSpec): boolean {
  const legend = (s: PlotSpec): boolean => s.series.some((x) => x.quiet !== true);
  return (
    a.xLabel === b.xLabel &&
    a.yLabel === b.yLabel &&
    (a.xRange === undefined) === (b.xRange === undefined) &&
    JSON.stringify(a.xTicks ?? null) === JSON.stringify(b.xTicks ?? null) &&
    legend(a) === legend(b)
  );
}

/** Equal within a millionth of their span (uPlot rounds scale limits). */
function sameRange(a: [number, number], b: [number, number]): boolean {
  const tolerance = 1e-6 * Math.max(Math.abs(b[1] - b[0]), 1e-12);
  return Math.abs(a[0] - b[0]) <= tolerance && Math.abs(a[1] - b[1]) <= tolerance;
}

function padded([min, max]: [number, number]): [number, number] {
  const pad = (max - min) * 0.06;
  return [min - pad, max + pad];
}

function hideQuietLegendRows(plot: uPlot, spec: PlotSpec): void {
  const rows = plot.root.querySelectorAll('.u-legend .u-series');
  spec.series.forEach((s, i) => {
    const row = rows[i + 1];
    if (s.quiet === true && row instanceof HTMLElement) row.style.display = 'none';
  });
}

/** Draws the marks of a spec on the uPlot canvas, clipped to the plot area. */
function drawMarks(u: uPlot, marks: readonly Mark[]): void {
  const ctx = u.ctx;
  const { left, top, width, height } = u.bbox;
  const ratio = window.devicePixelRatio || 1;
  ctx.save();
  ctx.beginPath();
  ctx.rect(left, top, width, height);
  ctx.clip();
  ctx.font = FONT.replace('12px', `${Math.round(12 * ratio)}px`);
  ctx.textBaseline = 'bottom';
  for (const mark of marks) {
    if (mark.kind === 'shade') {
      const x0 = u.valToPos(mark.from, 'x', true);
      const x1 = u.valToPos(mark.to, 'x', true);
      ctx.fillStyle = mark.color;
      ctx.fillRect(Math.min(x0, x1), top, Math.abs(x1 - x0), height);
      if (mark.text !== undefined) {
        // Caption inside the shade, on the side facing the middle of the plot.
        const onRight = (x0 + x1) / 2 > left + width / 2;
        ctx.fillStyle = '#444';
        ctx.textAlign = onRight ? 'right' : 'left';
        ctx.fillText(mark.text, onRight ? Math.max(x0, x1) - 3 * ratio : Math.min(x0, x1) + 3 * ratio, top + 16 * ratio);
      }
    } else if (mark.kind === 'vline') {
      const x = u.valToPos(mark.x, 'x', true);
      ctx.strokeStyle = mark.color;
      ctx.lineWidth = 1.5 * ratio;
      ctx.setLineDash((mark.dash ?? [6, 4]).map((d) => d * ratio));
      ctx.beginPath();
      ctx.moveTo(x, top);
      ctx.lineTo(x, top + height);
      ctx.stroke();
      ctx.setLineDash([]);
      if (mark.text !== undefined) {
        ctx.fillStyle = mark.color;
        ctx.textAlign = 'left';
        ctx.fillText(mark.text, x + 4 * ratio, top + 16 * ratio);
      }
    } else if (mark.kind === 'errorbar') {
      const x = u.valToPos(mark.x, 'x', true);
      const y0 = u.valToPos(mark.low, 'y', true);
      const y1 = u.valToPos(mark.high, 'y', true);
      const cap = 5 * ratio;
      ctx.strokeStyle = mark.color;
      ctx.lineWidth = 1.5 * ratio;
      ctx.beginPath();
      ctx.moveTo(x, y0);
      ctx.lineTo(x, y1);
      ctx.moveTo(x - cap, y0);
      ctx.lineTo(x + cap, y0);
      ctx.moveTo(x - cap, y1);
      ctx.lineTo(x + cap, y1);
      ctx.stroke();
    } else if (mark.kind === 'point') {
      const x = u.valToPos(mark.x, 'x', true);
      const y = u.valToPos(mark.y, 'y', true);
      ctx.fillStyle = mark.color;
      ctx.strokeStyle = '#fff';
      ctx.lineWidth = 1.5 * ratio;
      ctx.beginPath();
      ctx.arc(x, y, 4.5 * ratio, 0, 2 * Math.PI);
      ctx.fill();
      ctx.stroke();
      if (mark.text !== undefined) {
        ctx.textAlign = 'left';
        ctx.fillText(mark.text, x + 7 * ratio, y - 3 * ratio);
      }
    } else {
      const x = u.valToPos(mark.x, 'x', true);
      const y = u.valToPos(mark.y, 'y', true) - (mark.rise ?? 0) * ratio;
      ctx.fillStyle = mark.color;
      ctx.textAlign = mark.align ?? 'center';
      ctx.fillText(mark.text, x, y);
    }
  }
  ctx.restore();
}
