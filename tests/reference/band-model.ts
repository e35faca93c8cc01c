/**
 * Slow, obviously correct reference for src/spectrum/band-model.ts, used only
 * in tests/spectrum/band-model.test.ts: the model written from its
 * definition (every band evaluated everywhere, the edge as a plain Gaussian
 * of centre xEnd + d and height A·exp(4 ln2 d²/W²)), the Jacobian by central
 * differences, and the weighted normal equations as dense sums.
 */
import { referenceJacobian } from './spectrum-kernels.js';

export interface ReferenceLayout {
  bands: number;
  edge: boolean;
  polynomialLength: number;
  centre: number;
  halfWidth: number;
  xEnd: number;
}

function gaussian(x: number, c: number, h: number, w: number): number {
  return h * Math.exp((-4 * Math.LN2 * (x - c) ** 2) / (w * w));
}

export function referenceModel(x: number[], layout: ReferenceLayout, p: number[]): number[] {
  return x.map((xi) => {
    let v = 0;
    for (let j = 0; j < layout.bands; j++) v += gaussian(xi, p[3 * j]!, p[3 * j + 1]!, p[3 * j + 2]!);
    let next = 3 * layout.bands;
    if (layout.edge) {
      const [a, d, w] = [p[next]!, p[next + 1]!, p[next + 2]!];
      v += gaussian(xi, layout.xEnd + d, a * Math.exp((4 * Math.LN2 * d * d) / (w * w)), w);
      next += 3;
    }
    const t = (xi - layout.centre) / layout.halfWidth;
    for (let k = 0; k < layout.polynomialLength; k++) v += p[next + k]! * t ** k;
    return v;
  });
}

/** JᵀWJ, JᵀW r and Σ w² r² (W = diag(weight²)), dense. */
export function referenceNormal(x: number[], y: number[], weights: number[], layout: ReferenceLayout, p: number[]): { a: number[][]; g: number[]; cost: number } {
  const model = referenceModel(x, layout, p);
  const jac = referenceJacobian((q) => referenceModel(x, layout, q), p, 1e-7);
  const q = p.length;
  const a = Array.from({ length: q }, () => new Array<number>(q).fill(0));
  const g = new Array<number>(q).fill(0);
  let cost = 0;
  x.forEach((_, i) => {
    const w2 = weights[i]! ** 2;
    const r = y[i]! - model[i]!;
    cost += w2 * r * r;
    for (let u = 0; u < q; u++) {
      g[u]! += w2 * jac[i]![u]! * r;
      for (let v = 0; v < q; v++) a[u]![v]! += w2 * jac[i]![u]! * jac[i]![v]!;
    }
  });
  return { a, g, cost };
}

/**
 * The products of the band fit's normal equations as xyBandModelNormal
 * summed them before jacobian-normal-products.ts: one pass per pair of
 * columns over their common window (jac column major, column u at u·n).
 */
export function referencePairwiseProducts(
  jac: Float64Array, r: Float64Array, from: Int32Array, to: Int32Array, n: number, q: number, a: Float64Array, g: Float64Array,
): void {
  for (let u = 0; u < q; u++) {
    const ou = u * n;
    const fu = from[u]!;
    const tu = to[u]!;
    let gs = 0;
    for (let i = fu; i < tu; i++) gs += jac[ou + i]! * r[i]!;
    g[u] = gs;
    for (let v = u; v < q; v++) {
      const lo = Math.max(fu, from[v]!);
      const hi = Math.min(tu, to[v]!);
      const ov = v * n;
      let s = 0;
      for (let i = lo; i < hi; i++) s += jac[ou + i]! * jac[ov + i]!;
      a[u * q + v] = s;
      a[v * q + u] = s;
    }
  }
}
