import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { freeIonTermsUnchecked } from '../../src/ligand-field/free-ion-terms.js';
import type { Level, ObservedIon } from './nist-levels.js';

/**
 * Free-ion parameters derived from observed levels (tests only): Racah B and
 * C by least squares over the term centroids, ζ from the ground term's fine
 * structure in intermediate coupling. Slow and simple on purpose.
 */

/** Term centroids ((2J+1)-weighted mean of the term's levels, common practice), cm-1. */
export function termCentroids(levels: readonly Level[]): Map<string, number> {
  const sums = new Map<string, { weight: number; sum: number }>();
  for (const [term, j, energy] of levels) {
    const s = sums.get(term) ?? { weight: 0, sum: 0 };
    s.weight += 2 * j + 1;
    s.sum += (2 * j + 1) * energy;
    sums.set(term, s);
  }
  return new Map([...sums].map(([term, s]) => [term, s.sum / s.weight]));
}

/** Golden-section minimum of a unimodal f on [lo, hi]. */
export function goldenMin(f: (x: number) => number, lo: number, hi: number, iterations = 60): number {
  const phi = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < iterations; i++) {
    const x1 = hi - phi * (hi - lo);
    const x2 = lo + phi * (hi - lo);
    if (f(x1) < f(x2)) hi = x2;
    else lo = x1;
  }
  return (lo + hi) / 2;
}

/**
 * B and C of the two-parameter Racah model fitted by least squares to every
 * observed term of d^n, energies above the ground term. Term energies are B
 * times a function of C/B, so for each ratio r the best B is linear; the
 * ratio is found by golden section on 2 ≤ C/B ≤ 7.
 */
export function racahFromTerms(ion: ObservedIon): { b: number; c: number; rms: number; terms: number } {
  const observed = termCentroids(ion.levels);
  const ground = observed.get(ion.ground)!;
  const keys = [...observed.keys()].filter((k) => k !== ion.ground);
  const at = (ratio: number) => {
    const terms = freeIonTermsUnchecked(ion.d, 1, ratio);
    const base = terms.find((t) => t.term === ion.ground)!.energy;
    const unit = keys.map((k) => {
      const term = terms.find((t) => t.term === k);
      if (!term) throw new Error(`d${ion.d} has no term ${k}`);
      return term.energy - base;
    });
    const obs = keys.map((k) => observed.get(k)! - ground);
    const b = unit.reduce((s, u, i) => s + u * obs[i]!, 0) / unit.reduce((s, u) => s + u * u, 0);
    const sse = unit.reduce((s, u, i) => s + (b * u - obs[i]!) ** 2, 0);
    return { b, c: b * ratio, sse };
  };
  const best = at(goldenMin((r) => at(r).sse, 2, 7));
  return { b: best.b, c: best.c, rms: Math.sqrt(best.sse / keys.length), terms: keys.length };
}

/**
 * ζ fitted to the J levels of the ground term (Dq = 0, the engine's full
 * intermediate coupling with the given B and C): the lowest distinct energies
 * are those levels. Returns ζ and the rms misfit of the levels, cm-1.
 */
export function zetaFromGroundTerm(ion: ObservedIon, b: number, c: number): { zeta: number; rms: number } {
  const observed = ion.levels.filter(([term]) => term === ion.ground).map(([, , e]) => e).sort((x, y) => x - y);
  const misfit = (zeta: number): number => {
    const energies = [...new Set(computeFieldLevels(ion.d, 'octahedral', { dq: 0, b, c, zeta, ds: 0, dt: 0 }).levels.map((l) => Math.round(l.energy * 1000) / 1000))].sort((x, y) => x - y);
    return observed.reduce((s, e, i) => s + (energies[i]! - e) ** 2, 0);
  };
  const zeta = goldenMin(misfit, 50, 1000, 40);
  return { zeta, rms: Math.sqrt(misfit(zeta) / Math.max(1, observed.length - 1)) };
}
