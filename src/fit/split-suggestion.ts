/**
 * A way forward when no assignment explains the bands (AUDIT3 finding 8):
 * several maxima close together are often the components of one split band
 * (the spin–orbit multiplet of 4A2 → 4T1(P) of tetrahedral Co(II) at
 * 14 300 / 15 000 / 16 000 cm-1, a Jahn–Teller doublet), which the cubic
 * model without spin–orbit coupling reads as one transition at their
 * centroid (common practice). The suggestion names the run of neighbouring
 * bands, each within the split-pair distance of the next (penalties.ts
 * splitPairLimit), and their centroid (weighted by integrated intensity,
 * area or ε·FWHM, when every band carries one, else their plain mean: as
 * observations.ts averages components), and is
 * only made when the band list with the centroid in their place fits: a
 * suggestion that fails too would send the chemist round in circles.
 */
import type { ObservedBand } from './bands.js';
import { averageObservations, sortObservations, type Observation } from './observations.js';
import { splitPairLimit } from './penalties.js';

export interface SplitSuggestion {
  /** Positions of the components, cm-1, ascending. */
  components: number[];
  /** Their centroid, cm-1 (rounded to 10 cm-1). */
  centroid: number;
  /** The band list to give instead: the other bands as given, and the centroid. */
  bands: ObservedBand[];
}

/** The longest run (≥ 2) of unflagged bands, each within splitPairLimit of the next; the lowest on a tie. */
export function splitRun(primary: readonly Observation[]): Observation[] | undefined {
  let best: Observation[] = [];
  let run: Observation[] = [];
  for (const o of primary) {
    const last = run[run.length - 1];
    if (last && o.position - last.position <= splitPairLimit(0.5 * (o.position + last.position))) run.push(o);
    else run = [o];
    if (run.length > best.length) best = [...run];
  }
  return best.length >= 2 ? best : undefined;
}

/**
 * The centroid reading of the bands, when one exists and `fits` accepts its
 * band list (the caller's fit, which throws or returns false when it fails).
 */
export function splitBandSuggestion(bands: readonly ObservedBand[], fits: (bands: ObservedBand[]) => boolean): SplitSuggestion | undefined {
  const sorted = sortObservations(bands);
  const run = splitRun(sorted.primary);
  if (!run) return undefined;
  const centroid = Math.round(averageObservations(run).position / 10) * 10;
  const inRun = new Set(run.flatMap((o) => o.bands));
  const others = bands.filter((b) => !inRun.has(b.index));
  const next: ObservedBand[] = [...others, { index: 0, position: centroid, flags: [] }]
    .sort((a, b) => a.position - b.position)
    .map((b, index) => ({ ...b, index }));
  let ok = false;
  try {
    ok = fits(next);
  } catch {
    ok = false;
  }
  return ok ? { components: run.map((o) => Math.round(o.position)), centroid, bands: next } : undefined;
}

/** "14300, 15000 and 16000". */
function listText(values: readonly number[]): string {
  return values.length <= 2 ? values.join(' and ') : `${values.slice(0, -1).join(', ')} and ${values[values.length - 1]}`;
}

/** The sentence the refusal adds. */
export function splitSuggestionText(s: SplitSuggestion, tenDq: number): string {
  return `are ${listText(s.components)} cm-1 the components of one split band (a spin–orbit multiplet, such as 4T1(P) of tetrahedral Co(II), or a Jahn–Teller doublet)? `
    + `Read as one band at their centroid, ${s.centroid} cm-1, they fit (10Dq ${Math.round(tenDq)} cm-1): give the bands as ${s.bands.map((b) => Math.round(b.position)).join(',')}; `
    + 'or fit the components with spin–orbit coupling (--zeta free-ion), and check its assignment';
}
