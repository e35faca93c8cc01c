/**
 * The band model and its least-squares normal equations, fast path:
 *
 *   model(x) = Σ_j h_j exp(−4 ln2 (x − c_j)² / w_j²)            bands
 *            + A exp(−4 ln2 ((x − xEnd)² − 2 (x − xEnd) d) / W²)  UV edge (optional)
 *            + Σ_k b_k t^k,  t = (x − centre) / halfWidth        baseline
 *
 * Parameter order (a Float64Array): for each band c, h, w (cm-1, signal,
 * cm-1); then, with an edge, A, d, W; then b_0..b_order.
 *
 * The edge is the low-energy tail of a Gaussian of FWHM W centred d cm-1
 * above xEnd (the top of the range), written with its value A *at xEnd*
 * instead of its height at the centre: the height at the centre,
 * A·exp(4 ln2 d²/W²), grows exponentially along the valley where d and W
 * trade off, which made the fit crawl; A stays well determined by the data.
 *
 * Bands are evaluated only within ±CUTOFF·w of their centre, where
 * exp(−4 ln2 · 2.75²) ≈ 8e-10 of the height: far below any noise.
 */
import { FOUR_LN2 } from './gaussian.js';
import { jacobianNormalProducts } from './jacobian-normal-products.js';
import type { PolynomialScale } from './xy-polynomial.js';

/** Bands reach ±CUTOFF FWHM from their centre. */
export const BAND_CUTOFF = 2.75;

export interface BandModelLayout {
  bands: number;
  edge: boolean;
  /** Number of baseline coefficients (order + 1). */
  polynomialLength: number;
  scale: PolynomialScale;
  /** Top of the range, cm-1 (the edge's reference point). */
  xEnd: number;
}

export function bandModelParameterCount(layout: BandModelLayout): number {
  return 3 * layout.bands + (layout.edge ? 3 : 0) + layout.polynomialLength;
}

/** First index i with x[i] ≥ v (x ascending). */
export function xLowerBound(x: Float64Array, v: number): number {
  let lo = 0;
  let hi = x.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((x[mid] as number) < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Model values at each x into `out` (length x.length); returns out. */
export function xBandModelValues(x: Float64Array, layout: BandModelLayout, p: Float64Array, out: Float64Array): Float64Array {
  const n = x.length;
  const { scale, polynomialLength } = layout;
  const e0 = 3 * layout.bands;
  const b0 = e0 + (layout.edge ? 3 : 0);
  for (let i = 0; i < n; i++) {
    const t = ((x[i] as number) - scale.centre) / scale.halfWidth;
    let v = 0;
    for (let k = polynomialLength - 1; k >= 0; k--) v = v * t + (p[b0 + k] as number);
    out[i] = v;
  }
  if (layout.edge) {
    const a = p[e0] as number;
    const d = p[e0 + 1] as number;
    const wd = p[e0 + 2] as number;
    const k = FOUR_LN2 / (wd * wd);
    for (let i = 0; i < n; i++) {
      const u = (x[i] as number) - layout.xEnd;
      out[i] = (out[i] as number) + a * Math.exp(-k * (u * u - 2 * u * d));
    }
  }
  for (let j = 0; j < layout.bands; j++) {
    const c = p[3 * j] as number;
    const h = p[3 * j + 1] as number;
    const w = p[3 * j + 2] as number;
    const k = FOUR_LN2 / (w * w);
    const hi = xLowerBound(x, c + BAND_CUTOFF * w);
    for (let i = xLowerBound(x, c - BAND_CUTOFF * w); i < hi; i++) {
      const dx = (x[i] as number) - c;
      out[i] = (out[i] as number) + h * Math.exp(-k * dx * dx);
    }
  }
  return out;
}

/**
 * Sum of squared residuals Σ (w_i (y_i − model_i))², weights w (1/σ_i;
 * null: all 1); `work` has length x.length.
 */
export function xyBandModelCost(
  x: Float64Array, y: Float64Array, weights: Float64Array | null, layout: BandModelLayout, p: Float64Array, work: Float64Array,
): number {
  xBandModelValues(x, layout, p, work);
  let s = 0;
  for (let i = 0; i < x.length; i++) {
    const r = ((y[i] as number) - (work[i] as number)) * (weights === null ? 1 : (weights[i] as number));
    s += r * r;
  }
  return s;
}

/** Work arrays for xyBandModelNormal, sized for n points and q parameters. */
export interface BandModelWork {
  /** Jacobian, column major (q × n), zero outside each column's window. */
  jacobian: Float64Array;
  residuals: Float64Array;
  from: Int32Array;
  to: Int32Array;
}

export function bandModelWork(n: number, q: number): BandModelWork {
  return { jacobian: new Float64Array(n * q), residuals: new Float64Array(n), from: new Int32Array(q), to: new Int32Array(q) };
}

/**
 * Weighted normal equations at p: fills `a` (q × q, row major, JᵀWJ with
 * J = ∂model/∂p, W = diag(w²)) and `g` (JᵀW r, r = y − model) and returns
 * the weighted sum of squares (xyBandModelCost). Products are summed only
 * where both columns can be nonzero. After the call `work.residuals` holds
 * the weighted residuals w_i r_i.
 */
export function xyBandModelNormal(
  x: Float64Array, y: Float64Array, weights: Float64Array | null, layout: BandModelLayout, p: Float64Array, a: Float64Array, g: Float64Array,
  work: BandModelWork,
): number {
  const n = x.length;
  const q = bandModelParameterCount(layout);
  const { jacobian: jac, residuals: r, from, to } = work;
  // Model values are summed in xBandModelValues' order (baseline, edge, bands)
  // from the same exponentials the Jacobian needs, so the cost is bit for bit
  // xyBandModelCost's while each exponential is computed once.
  const e0 = 3 * layout.bands;
  const b0 = e0 + (layout.edge ? 3 : 0);
  const { scale, polynomialLength } = layout;
  for (let m = 0; m < polynomialLength; m++) {
    from[b0 + m] = 0;
    to[b0 + m] = n;
  }
  for (let i = 0; i < n; i++) {
    const t = ((x[i] as number) - scale.centre) / scale.halfWidth;
    let v = 0;
    for (let k = polynomialLength - 1; k >= 0; k--) v = v * t + (p[b0 + k] as number);
    r[i] = v;
    let power = 1;
    for (let m = 0; m < polynomialLength; m++) {
      jac[(b0 + m) * n + i] = power;
      power *= t;
    }
  }
  if (layout.edge) {
    const amp = p[e0] as number;
    const d = p[e0 + 1] as number;
    const wd = p[e0 + 2] as number;
    const k = FOUR_LN2 / (wd * wd);
    for (let m = 0; m < 3; m++) {
      from[e0 + m] = 0;
      to[e0 + m] = n;
    }
    const oe = e0 * n;
    for (let i = 0; i < n; i++) {
      const u = (x[i] as number) - layout.xEnd;
      const s = u * u - 2 * u * d;
      const e = Math.exp(-k * s);
      r[i] = (r[i] as number) + amp * e;
      jac[oe + i] = e;
      jac[oe + n + i] = amp * e * 2 * k * u;
      jac[oe + 2 * n + i] = (amp * e * 2 * k * s) / wd;
    }
  }
  for (let j = 0; j < layout.bands; j++) {
    const c = p[3 * j] as number;
    const h = p[3 * j + 1] as number;
    const w = p[3 * j + 2] as number;
    const k = FOUR_LN2 / (w * w);
    const lo = xLowerBound(x, c - BAND_CUTOFF * w);
    const hi = xLowerBound(x, c + BAND_CUTOFF * w);
    for (let m = 0; m < 3; m++) {
      from[3 * j + m] = lo;
      to[3 * j + m] = hi;
    }
    const oc = 3 * j * n;
    for (let i = lo; i < hi; i++) {
      const dx = (x[i] as number) - c;
      const e = Math.exp(-k * dx * dx);
      r[i] = (r[i] as number) + h * e;
      const he2k = 2 * h * e * k;
      jac[oc + i] = he2k * dx;
      jac[oc + n + i] = e;
      jac[oc + 2 * n + i] = (he2k * dx * dx) / w;
    }
  }
  let cost = 0;
  for (let i = 0; i < n; i++) {
    const v = ((y[i] as number) - (r[i] as number)) * (weights === null ? 1 : (weights[i] as number));
    r[i] = v;
    cost += v * v;
  }
  if (weights !== null) {
    for (let u = 0; u < q; u++) {
      const ou = u * n;
      for (let i = from[u] as number; i < (to[u] as number); i++) jac[ou + i] = (jac[ou + i] as number) * (weights[i] as number);
    }
  }
  // Products a block of columns at a time; the same sums as one pass per pair (jacobian-normal-products.ts).
  jacobianNormalProducts(jac, r, from, to, n, q, a, g);
  return cost;
}
