/**
 * Overlapping components of one envelope reported as one band. Real bands
 * are asymmetric (log-normal, skewed to high energy) and carry unresolved
 * spin–orbit or Jahn–Teller components (the 4T1(P) multiplet of tetrahedral
 * Co(II)); a sum of Gaussians describes such a band with two or three
 * components that overlap closely, and reporting each as a transition would
 * hand the ligand-field fit bands that do not exist.
 *
 * Rule: neighbouring broad components (FWHM at least `minFwhm`, so never a
 * narrow spin-flip line on a broad band) less than `maxSeparation` × their
 * mean FWHM apart are joined, closest pair first, when their sum shows one
 * minimum of the second derivative, not two (no maximum or shoulder of its
 * own, as a chemist reads a spectrum), or when the second-derivative band
 * search found one band there in the data (`dataBands`: two Gaussians
 * fitted to one skewed band can make a shoulder the data do not have),
 * while the joined components span
 * no more than `span` cm-1 (2 000: the spread of spin–orbit multiplets of
 * first-row T terms, ζ ≈ 100–650 cm-1, and the limit the ligand-field fit
 * uses for a split pair, src/fit/penalties.ts; common practice). Resolved
 * pairs (the Ni(II) 3T1g(F)/1Eg doublet, a split band's distinct shoulder)
 * stay two bands, for the fit to read.
 *
 * The joined band stands at the maximum of the components' sum, with that
 * height and the FWHM that keeps their total area: the transition energy
 * of an asymmetric band is its maximum, its mean lying 100–400 cm-1 above
 * (on the validation corpus, tests/accuracy/, the maximum of such groups was
 * off the true band maximum by 1 % on average, the area-weighted mean by
 * 1.8 %), and an unresolved multiplet's maximum lies within a few hundred
 * cm-1 of its centre (processSpectrum then reports it at the data's
 * maximum, or at the components' centroid when the top lies above their
 * mean: see bandMaxima there). Its position σ is that of the area-weighted mean,
 * √Σ (a_k/A)² σ_k² (the components' covariance neglected).
 */
import { gaussiansMerge } from './fit-band-model.js';
import { FOUR_LN2, gaussianValue } from './gaussian.js';
import type { GaussianParameters } from './xy-refine-bands.js';

export interface GroupMultipletsOptions {
  /** Largest span, cm-1, from the first to the last component of one band. @default 2000 */
  span?: number;
  /** Narrowest component joined, cm-1 (narrower ones are spin-forbidden lines and stay apart). @default 1000 */
  minFwhm?: number;
  /** Neighbours at least this fraction of their mean FWHM apart are never joined. @default 1 */
  maxSeparation?: number;
  /**
   * Positions of the bands the second-derivative search found in the data
   * (before any fit), cm-1. Two components whose sum shows two curvature
   * minima are still one band when the data showed one there. @default none (the model's curvature decides)
   */
  dataBands?: readonly number[];
}

export interface MultipletGroups {
  /** One band per group, ascending position. */
  bands: GaussianParameters[];
  /** Position σ of each band, cm-1 (NaN when a component's is unknown). */
  positionSd: Float64Array;
  /** The fitted components of each band (one element for a band alone). */
  components: GaussianParameters[][];
}

interface Group {
  parts: GaussianParameters[];
  sds: number[];
  merged: GaussianParameters;
}

/** Groups bands (any order) with their position σ; see the file's docstring. */
export function gaussiansGroupMultiplets(bands: readonly GaussianParameters[], positionSd: Float64Array, options: GroupMultipletsOptions = {}): MultipletGroups {
  const { span = 2000, minFwhm = 1000, maxSeparation = 1, dataBands } = options;
  const order = bands.map((b, k) => ({ b, sd: positionSd[k] as number })).sort((p, q) => p.b.position - q.b.position);
  let groups: Group[] = order.map(({ b, sd }) => ({ parts: [b], sds: [sd], merged: b }));
  for (;;) {
    let best = -1;
    let gap = Number.POSITIVE_INFINITY;
    for (let j = 0; j + 1 < groups.length; j++) {
      const p = groups[j]!;
      const q = groups[j + 1]!;
      const last = p.parts[p.parts.length - 1]!;
      const first = q.parts[0]!;
      if (last.fwhm < minFwhm || first.fwhm < minFwhm) continue;
      const d = first.position - last.position;
      if (d >= maxSeparation * 0.5 * (last.fwhm + first.fwhm)) continue;
      if (gaussiansCurvatureMinima([last, first]) > 1 && dataBandsBetween(dataBands, last, first) > 1) continue;
      if (q.parts[q.parts.length - 1]!.position - p.parts[0]!.position > span) continue;
      if (d < gap) {
        gap = d;
        best = j;
      }
    }
    if (best < 0) break;
    const p = groups[best]!;
    const q = groups[best + 1]!;
    groups = [...groups.slice(0, best), { parts: [...p.parts, ...q.parts], sds: [...p.sds, ...q.sds], merged: gaussiansMerge(p.merged, q.merged) }, ...groups.slice(best + 2)];
  }
  return {
    bands: groups.map((g) => (g.parts.length > 1 ? gaussiansEnvelopeBand(g.parts, g.merged) : g.merged)),
    positionSd: Float64Array.from(groups, (g) => {
      if (g.parts.length === 1) return g.sds[0] as number;
      const area = g.parts.reduce((s, b) => s + b.height * b.fwhm, 0);
      return Math.sqrt(g.parts.reduce((s, b, k) => s + ((b.height * b.fwhm) / area) ** 2 * (g.sds[k] as number) ** 2, 0));
    }),
    components: groups.map((g) => g.parts),
  };
}

/** Sampling step, cm-1, of the search for an envelope's maximum (far below any band's σ). */
const ENVELOPE_STEP = 2;

/**
 * The band standing for components: at the maximum of their sum (sampled
 * every ENVELOPE_STEP cm-1 between the outermost components), that height,
 * and the FWHM of a Gaussian of the merged band's area.
 */
function gaussiansEnvelopeBand(parts: readonly GaussianParameters[], merged: GaussianParameters): GaussianParameters {
  const from = parts[0]!.position;
  const to = parts[parts.length - 1]!.position;
  let position = merged.position;
  let height = Number.NEGATIVE_INFINITY;
  for (let x = from; x <= to; x += ENVELOPE_STEP) {
    let v = 0;
    for (const b of parts) v += gaussianValue(x, b.position, b.height, b.fwhm);
    if (v > height) {
      height = v;
      position = x;
    }
  }
  return { position, height, fwhm: (merged.height * merged.fwhm) / height };
}

/**
 * Number of distinct minima of the second derivative of a sum of Gaussians
 * (each a maximum or a shoulder as the eye and the second-derivative band
 * search see it), sampled at a fiftieth of the narrowest FWHM over the
 * components ± one FWHM. Analytic: g'' = h·e^(−a u²)(4a²u² − 2a), a = 4 ln2/w².
 */
export function gaussiansCurvatureMinima(parts: readonly GaussianParameters[]): number {
  const narrowest = parts.reduce((m, b) => Math.min(m, b.fwhm), Number.POSITIVE_INFINITY);
  const from = parts.reduce((m, b) => Math.min(m, b.position - b.fwhm), Number.POSITIVE_INFINITY);
  const to = parts.reduce((m, b) => Math.max(m, b.position + b.fwhm), Number.NEGATIVE_INFINITY);
  const step = narrowest / 50;
  const second = (x: number): number => parts.reduce((s, b) => {
    const a = FOUR_LN2 / (b.fwhm * b.fwhm);
    const u = x - b.position;
    return s + b.height * Math.exp(-a * u * u) * (4 * a * a * u * u - 2 * a);
  }, 0);
  let count = 0;
  let previous = second(from - step);
  let current = second(from);
  for (let x = from + step; x <= to + step; x += step) {
    const next = second(x);
    if (current < 0 && current < previous && current <= next) count++;
    previous = current;
    current = next;
  }
  return count;
}

/** How many data bands lie between two components (within a quarter FWHM beyond each); 2 (apart) when unknown. */
function dataBandsBetween(dataBands: readonly number[] | undefined, p: GaussianParameters, q: GaussianParameters): number {
  if (dataBands === undefined) return 2;
  return dataBands.filter((x) => x >= p.position - 0.25 * p.fwhm && x <= q.position + 0.25 * q.fwhm).length;
}
