/**
 * How much of a band's position rests on an assumed C: errors in variables
 * for the C/B ratio a fit holds fixed (likelihood.ts, "Positions").
 *
 * When C is not fitted it is tied to B by C = γ·B, γ the free ion's C0/B0
 * (settings.ts), and the C/B prior (likelihood.ts) says how far a complex's
 * γ may lie from it. A transition whose energy depends on C (4A2g → 2Eg of
 * Cr(III), ≈ 9B + 3C; every quartet of high-spin d5; the singlets of
 * low-spin d6) is then uncertain by ∂ΔE/∂C · σ_C with σ_C = B·σ(C/B), on
 * top of its own σ and the model error; it adds (∂ΔE/∂C · σ_C)² to the
 * band's variance. ∂ΔE/∂C is the derivative of the assigned transition
 * energy (excited minus ground level) with respect to C at fixed Dq and B,
 * dimensionless. A transition within one spin multiplicity of d3 or d8
 * (quartets, triplets) does not depend on C at all: the engine gives
 * ∂ΔE/∂C = 0 to rounding, and it is set to exactly 0 below ZERO_DERIVATIVE,
 * so such fits are unchanged.
 *
 * The derivative comes from central differences of the engine's levels
 * (two engine calls at C ± h; the engine exposes energies, not
 * eigenvectors, so Hellmann–Feynman ⟨ψ|∂H/∂C|ψ⟩ is the test's reference,
 * tests/fit/c-sensitivity.test.ts), or, on the unit-B scan, from a second
 * scan at γ + δ (one scan per (d, geometry, γ), cached), interpolated in
 * Dq/B as the scan energies are.
 */
import { levelsAt as computeLevels } from './engine.js';
import type { FieldParameters, Geometry } from '../ligand-field/types.js';
import { scanEnergyAt } from './interpolate.js';
import { effectiveWeight, LIKELIHOOD } from './likelihood.js';
import { assignedEnergies } from './refine.js';
import { scanLevels, type LevelScan } from './scan.js';
import type { CMode, Penalty } from './types.js';

/** |∂ΔE/∂C| below this is 0: the engine's rounding, not a dependence on C. */
export const ZERO_DERIVATIVE = 1e-6;

/**
 * Standard deviation of the C/B prior (likelihood.ts): a split normal, σ_low
 * below its centre and σ_high above, has variance
 * (1 − 2/π)(σ_high − σ_low)² + σ_low·σ_high (the textbook moments of the
 * two-piece normal): 1.62 for σ 1.2 and 2.0.
 */
export function cOverBPriorSd(sigmaLow: number = LIKELIHOOD.cOverBSigmaLow, sigmaHigh: number = LIKELIHOOD.cOverBSigmaHigh): number {
  return Math.sqrt((1 - 2 / Math.PI) * (sigmaHigh - sigmaLow) ** 2 + sigmaLow * sigmaHigh);
}

/**
 * σ(C/B) a fit must carry into its band variances: the prior's standard
 * deviation when C is tied to B by an assumed ratio (the free ion's, or the
 * default); 0 when C is fitted, fixed by the user, or the user gave the
 * ratio (then it is the user's statement, not an assumption of the fit).
 */
export function assumedCOverBSd(settings: { mode: CMode; cOverBGiven: boolean }): number {
  return settings.mode === 'ratio' && !settings.cOverBGiven ? cOverBPriorSd() : 0;
}

/**
 * ∂(E_level − E_ground)/∂C at fixed Dq and B for each assigned level key,
 * by central differences of the engine's levels at C ± h (h = 10⁻³·C, at
 * least 1 cm-1); |value| < ZERO_DERIVATIVE is 0. NaN where a key is missing.
 */
export function transitionCDerivatives(
  d: number,
  geometry: Geometry,
  params: FieldParameters,
  groundKey: string,
  levelKeys: readonly string[],
): Float64Array {
  const h = Math.max(1, 1e-3 * params.c);
  const up = new Float64Array(levelKeys.length);
  const down = new Float64Array(levelKeys.length);
  const keys = [...levelKeys];
  assignedEnergies(computeLevels(d, geometry, { ...params, c: params.c + h }), groundKey, keys, up);
  assignedEnergies(computeLevels(d, geometry, { ...params, c: params.c - h }), groundKey, keys, down);
  return Float64Array.from(up, (u, i) => snapped((u - down[i]!) / (2 * h)));
}

function snapped(derivative: number): number {
  return Math.abs(derivative) < ZERO_DERIVATIVE ? 0 : derivative;
}

/** The scan's relative step in C/B for its derivative scan. */
const SCAN_STEP = 1e-5;

const derivativeScans = new WeakMap<LevelScan, LevelScan>();

/**
 * A LevelScan whose `energies` are ∂e/∂γ (e = E/B, γ = C/B; equal to ∂E/∂C)
 * of each level above the scan's ground level at each Dq/B, by a forward
 * difference against a scan at γ·(1 + 10⁻⁵); cached per scan. Same ids,
 * grid and ground as `scan`, so scanEnergyAt interpolates it and gives
 * ∂ΔE/∂C of any level above any assumed ground.
 */
export function scanCDerivatives(scan: LevelScan): LevelScan {
  const hit = derivativeScans.get(scan);
  if (hit) return hit;
  const delta = SCAN_STEP * scan.cOverB;
  const shifted = scanLevels(scan.d, scan.geometry, scan.cOverB + delta, scan.x);
  const n = scan.ids.length;
  const m = shifted.ids.length;
  const energies = new Float64Array(scan.energies.length).fill(Number.NaN);
  for (let j = 0; j < scan.x.length; j++) {
    const g = scan.ground[j]!;
    const gShifted = shifted.index.get(scan.ids[g]!.key);
    if (gShifted === undefined) continue;
    const zero = shifted.energies[j * m + gShifted]!;
    for (let k = 0; k < n; k++) {
      const kShifted = shifted.index.get(scan.ids[k]!.key);
      if (kShifted === undefined) continue;
      const moved = shifted.energies[j * m + kShifted]! - zero;
      energies[j * n + k] = (moved - scan.energies[j * n + k]!) / delta;
    }
  }
  const derivative: LevelScan = { ...scan, energies };
  derivativeScans.set(scan, derivative);
  return derivative;
}

/** ∂ΔE/∂C of each level above `ground` at Dq/B = x, from the derivative scan; |value| < ZERO_DERIVATIVE is 0. */
export function scanTransitionCDerivatives(scan: LevelScan, ground: number, levels: ArrayLike<number>, x: number): Float64Array {
  const derivative = scanCDerivatives(scan);
  return Float64Array.from({ length: levels.length }, (_, i) => snapped(scanEnergyAt(derivative, levels[i]!, ground, x)));
}

/** σ_C of each band, cm-1: |∂ΔE/∂C|·B·σ(C/B). */
export function sigmaFromCOf(derivatives: Float64Array, b: number, cOverBSd: number): Float64Array {
  return Float64Array.from(derivatives, (g) => (cOverBSd > 0 && Number.isFinite(g) ? Math.abs(g) * b * cOverBSd : 0));
}

/** Whether any band's σ was widened. */
export function anyWidened(sigmaFromC: Float64Array | undefined): boolean {
  return sigmaFromC !== undefined && sigmaFromC.some((s) => s > 0);
}

/**
 * The normalisation the widened σ costs: the score is −2·ln of a Gaussian
 * density, χ² + Σ ln(2π·σ_eff²), and its ln σ_eff² terms cancel between
 * assignments only while σ_eff does not depend on the assignment. With σ_C
 * it does, so the score adds Σ ln(σ_eff²/(σ² + σm²)) = Σ ln(1 + σ_C²/(σ² +
 * σm²)): without it an assignment whose transitions all depend on C (the
 * doublets of low-spin Co(II)) would win by its discounted χ² alone.
 * Only for an over-determined fit (m bands > p parameters): in an exactly
 * determined one every labelling reproduces the bands, the widened band is
 * the one that fixes a parameter, and the term would only prefer the
 * labelling with the smallest B (σ_C grows with B), which the data do not
 * say (a Jahn–Teller pair of Mn(III) and one sharp line: B rests on the
 * line alone). Undefined when no band is widened or m ≤ p.
 */
export function assumedCPenalty(
  observations: ReadonlyArray<{ position: number; sigma: number }>,
  sigmaFromC: Float64Array,
  parameters: number,
): Penalty | undefined {
  if (observations.length <= parameters) return undefined;
  let amount = 0;
  let count = 0;
  observations.forEach((o, i) => {
    const s = sigmaFromC[i] ?? 0;
    if (!(s > 0)) return;
    amount += Math.log(1 + s * s * effectiveWeight(o.position, o.sigma));
    count++;
  });
  if (count === 0) return undefined;
  return {
    rule: 'assumed-c-over-b', amount,
    detail: `${count} band${count === 1 ? '' : 's'} on transitions that depend on C, with C/B assumed: σ widened by the C/B prior's spread`,
  };
}
