/**
 * One uPlot chart built from a PlotSpec: drag on the plot to zoom in x,
 * double-click or "Reset zoom" to go back, marks drawn on the canvas, width
 * following its container, and a click handler for picking a position.
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
  readonly spec: PlotSpec;
  readonly plot: uPlot;
  private readonly observer: ResizeObserver;
  private readonly container: HTMLElement;

  constructor(container: HTMLElement, spec: PlotSpec, options: PlotFrameOptions = {}) {
    const { height = 320, onPick } = options;
    this.spec = spec;
    this.container = container;
    container.replaceChildren();
    const yRange = spec.yRange ?? padded(dataRange(spec.ys));
    const opts: uPlot.Options = {
      width: Math.max(320, container.clientWidth || 640),
      height,
      scales: {
        x: spec.xRange === undefined ? { time: false } : { time: false, auto: false, range: () => spec.xRange! },
        y: { auto: false, range: () => yRange },
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
        ...spec.series.map((s) => {
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
        }),
      ],
      legend: { show: spec.series.some((s) => s.quiet !== true) },
      cursor: { drag: { x: true, y: false, setScale: true } },
      hooks: { draw: [(u: uPlot) => drawMarks(u, spec.marks)] },
    };
    const data = [spec.x, ...spec.ys] as unknown as uPlot.AlignedData;
    this.plot = new uPlot(opts, data, container);
    hideQuietLegendRows(this.plot, spec);
    if (onPick !== undefined) this.bindPick(onPick);
    this.observer = new ResizeObserver(() => {
      const width = Math.max(320, this.container.clientWidth);
      if (Math.abs(width - this.plot.width) > 2) this.plot.setSize({ width, height });
    });
    this.observer.observe(container);
  }

  /** Back to the full x range of the data. */
  resetZoom(): void {
    const x = this.spec.x;
    if (this.spec.xRange !== undefined) this.plot.setScale('x', { min: this.spec.xRange[0], max: this.spec.xRange[1] });
    else if (x.length > 1) this.plot.setScale('x', { min: x[0]!, max: x[x.length - 1]! });
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

  private bindPick(onPick: (x: number) => void): void {
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
      if (moved > 3) return;
      const rect = over.getBoundingClientRect();
      onPick(this.plot.posToVal(event.clientX - rect.left, 'x'));
    });
  }
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
