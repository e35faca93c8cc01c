/**
 * The products of the band fit's normal equations, JᵀWJ and JᵀWr, summed a
 * block at a time: the same numbers, bit for bit, as one pass per pair of
 * columns (the plain loop, kept in tests/reference/band-model.ts), in less
 * time. Called by xyBandModelNormal (band-model.ts).
 *
 * The Jacobian's columns come in runs that share the window where they can
 * be nonzero: the three of a band (c, h, w), the edge and baseline columns
 * (the whole range). They are cut into chunks of up to three consecutive
 * columns with one window, and one pass over two chunks' common window sums
 * all their products (nine for two chunks of three) in separate
 * accumulators, reading each value once for up to three products instead of
 * once per product. Each entry is still Σ_i J_ui J_vi over the same i in
 * ascending order, so nothing downstream changes
 * (tests/spectrum/jacobian-normal-products.test.ts compares them exactly).
 */

/** Largest chunk: three accumulators a column, nine for a pair of chunks. */
const CHUNK = 3;

/**
 * Fills `a` (q × q, row major) with Σ J_ui J_vi and `g` (q) with Σ J_ui r_i,
 * each sum over i in [from, to) of the columns involved (their common window
 * for a pair). `jac` is column major (column u at u·n), zero outside each
 * column's window; `r` has length n.
 */
export function jacobianNormalProducts(
  jac: Float64Array, r: Float64Array, from: Int32Array, to: Int32Array, n: number, q: number, a: Float64Array, g: Float64Array,
): void {
  const chunks = columnChunks(from, to, q);
  for (let ci = 0; ci < chunks.length; ci += 2) {
    const u0 = chunks[ci] as number;
    const nu = chunks[ci + 1] as number;
    const fu = from[u0] as number;
    const tu = to[u0] as number;
    if (nu === 3) products3Diagonal(jac, r, n, u0, fu, tu, a, g, q);
    else {
      for (let u = u0; u < u0 + nu; u++) {
        g[u] = product(jac, u * n, r, 0, fu, tu);
        for (let v = u; v < u0 + nu; v++) put(a, q, u, v, product(jac, u * n, jac, v * n, fu, tu));
      }
    }
    for (let cj = ci + 2; cj < chunks.length; cj += 2) {
      const v0 = chunks[cj] as number;
      const nv = chunks[cj + 1] as number;
      const lo = Math.max(fu, from[v0] as number);
      const hi = Math.min(tu, to[v0] as number);
      if (nu === 3 && nv === 3) products3x3(jac, n, u0, v0, lo, hi, a, q);
      else if (nu === 3 && nv === 2) products3x2(jac, n, u0, v0, lo, hi, a, q);
      else {
        for (let u = u0; u < u0 + nu; u++) {
          for (let v = v0; v < v0 + nv; v++) put(a, q, u, v, product(jac, u * n, jac, v * n, lo, hi));
        }
      }
    }
  }
}

/** Runs of up to CHUNK consecutive columns with the same window, as [first column, size] pairs. */
function columnChunks(from: Int32Array, to: Int32Array, q: number): number[] {
  const chunks: number[] = [];
  let u = 0;
  while (u < q) {
    let size = 1;
    while (size < CHUNK && u + size < q && from[u + size] === from[u] && to[u + size] === to[u]) size++;
    chunks.push(u, size);
    u += size;
  }
  return chunks;
}

function put(a: Float64Array, q: number, u: number, v: number, s: number): void {
  a[u * q + v] = s;
  a[v * q + u] = s;
}

/** Σ_{lo ≤ i < hi} b[ob + i]·c[oc + i], i ascending. */
function product(b: Float64Array, ob: number, c: Float64Array, oc: number, lo: number, hi: number): number {
  let s = 0;
  for (let i = lo; i < hi; i++) s += (b[ob + i] as number) * (c[oc + i] as number);
  return s;
}

/** The 3 × 3 block of two chunks (columns u0.., v0..) over [lo, hi), into `a` and its mirror. */
function products3x3(jac: Float64Array, n: number, u0: number, v0: number, lo: number, hi: number, a: Float64Array, q: number): void {
  const ou0 = u0 * n;
  const ou1 = ou0 + n;
  const ou2 = ou1 + n;
  const ov0 = v0 * n;
  const ov1 = ov0 + n;
  const ov2 = ov1 + n;
  let s00 = 0, s01 = 0, s02 = 0, s10 = 0, s11 = 0, s12 = 0, s20 = 0, s21 = 0, s22 = 0;
  for (let i = lo; i < hi; i++) {
    const u0i = jac[ou0 + i] as number;
    const u1i = jac[ou1 + i] as number;
    const u2i = jac[ou2 + i] as number;
    const v0i = jac[ov0 + i] as number;
    const v1i = jac[ov1 + i] as number;
    const v2i = jac[ov2 + i] as number;
    s00 += u0i * v0i; s01 += u0i * v1i; s02 += u0i * v2i;
    s10 += u1i * v0i; s11 += u1i * v1i; s12 += u1i * v2i;
    s20 += u2i * v0i; s21 += u2i * v1i; s22 += u2i * v2i;
  }
  put(a, q, u0, v0, s00); put(a, q, u0, v0 + 1, s01); put(a, q, u0, v0 + 2, s02);
  put(a, q, u0 + 1, v0, s10); put(a, q, u0 + 1, v0 + 1, s11); put(a, q, u0 + 1, v0 + 2, s12);
  put(a, q, u0 + 2, v0, s20); put(a, q, u0 + 2, v0 + 1, s21); put(a, q, u0 + 2, v0 + 2, s22);
}

/** A chunk of three against one of two (a band against the last baseline terms), as products3x3. */
function products3x2(jac: Float64Array, n: number, u0: number, v0: number, lo: number, hi: number, a: Float64Array, q: number): void {
  const ou0 = u0 * n;
  const ou1 = ou0 + n;
  const ou2 = ou1 + n;
  const ov0 = v0 * n;
  const ov1 = ov0 + n;
  let s00 = 0, s01 = 0, s10 = 0, s11 = 0, s20 = 0, s21 = 0;
  for (let i = lo; i < hi; i++) {
    const u0i = jac[ou0 + i] as number;
    const u1i = jac[ou1 + i] as number;
    const u2i = jac[ou2 + i] as number;
    const v0i = jac[ov0 + i] as number;
    const v1i = jac[ov1 + i] as number;
    s00 += u0i * v0i; s01 += u0i * v1i;
    s10 += u1i * v0i; s11 += u1i * v1i;
    s20 += u2i * v0i; s21 += u2i * v1i;
  }
  put(a, q, u0, v0, s00); put(a, q, u0, v0 + 1, s01);
  put(a, q, u0 + 1, v0, s10); put(a, q, u0 + 1, v0 + 1, s11);
  put(a, q, u0 + 2, v0, s20); put(a, q, u0 + 2, v0 + 1, s21);
}

/** A chunk of three with itself (upper triangle) and its three entries of g, over [lo, hi). */
function products3Diagonal(
  jac: Float64Array, r: Float64Array, n: number, u0: number, lo: number, hi: number, a: Float64Array, g: Float64Array, q: number,
): void {
  const o0 = u0 * n;
  const o1 = o0 + n;
  const o2 = o1 + n;
  let s00 = 0, s01 = 0, s02 = 0, s11 = 0, s12 = 0, s22 = 0, g0 = 0, g1 = 0, g2 = 0;
  for (let i = lo; i < hi; i++) {
    const c0 = jac[o0 + i] as number;
    const c1 = jac[o1 + i] as number;
    const c2 = jac[o2 + i] as number;
    const ri = r[i] as number;
    g0 += c0 * ri; g1 += c1 * ri; g2 += c2 * ri;
    s00 += c0 * c0; s01 += c0 * c1; s02 += c0 * c2;
    s11 += c1 * c1; s12 += c1 * c2; s22 += c2 * c2;
  }
  g[u0] = g0;
  g[u0 + 1] = g1;
  g[u0 + 2] = g2;
  put(a, q, u0, u0, s00); put(a, q, u0, u0 + 1, s01); put(a, q, u0, u0 + 2, s02);
  put(a, q, u0 + 1, u0 + 1, s11); put(a, q, u0 + 1, u0 + 2, s12);
  put(a, q, u0 + 2, u0 + 2, s22);
}
