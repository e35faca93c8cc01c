import { FieldgapError } from '../errors.js';
import { blockHamiltonianInto } from './block-spectra.js';
import { createEigenWorkspace, symmetricEigenvaluesInPlace, symmetricTridiagonalInPlace, type EigenWorkspace } from './eigen-symmetric.js';
import type { FieldLevel } from './field-level-types.js';
import { irrepBlocks, type IrrepBlocks } from './irrep-blocks.js';
import type { ParentTable } from './labels.js';
import { energyTolerance } from './levels.js';
import { parentTableFor } from './parent-tables.js';
import { tridiagonalCountBelow } from './sturm-count.js';
import { CHANNEL_D4_IRREPS, D4_DIMENSION, tetragonalBlocks, type TetragonalBlocks } from './tetragonal-blocks.js';
import { tetragonalSpectrum } from './tetragonal-spectrum.js';

/**
 * The labelled spin-free levels of d^n (1..9) in a tetragonal field
 * (octahedral parent geometry, Dq ≠ 0), fast. Each level is (2S+1, D4h
 * irrep) with its octahedral parent: the i-th lowest (S, Γ4) level's parent
 * is the i-th lowest octahedral (S, Γ) level whose O → D4 reduction holds
 * Γ4 (the non-crossing rule along t·(Ds, Dt), see field-level-types.ts). The D4
 * channel of each octahedral irrep (O → D4: A1 → A1, A2 → B1, E → A1 + B1,
 * T1 → A2 + E, T2 → B2 + E), read backwards, says which cubic (S, Γ) lists
 * are merged for each channel: A1 ← A1, E; A2 ← T1; E ← T1, T2;
 * B1 ← A2, E; B2 ← T2. The cubic energies are the eigenvalues of the
 * irrep blocks (irrep-blocks.ts) at Dq, B, C, the names those of
 * computeLevels (parent-tables.ts): rank r of (S, Γ) is the r-th eigenvalue
 * of its block. Equal energies (within computeLevels' cluster tolerance)
 * merge in irrep-column order, as computeLevels sorts ties.
 *
 * Why it is fast (issue 15 asks for a labelled tetragonal evaluation at no
 * more than twice a labelled cubic one; bench/ligand-field.ts measures the
 * ratio, and the tetragonal eigenvalues alone are about 1.7× of it):
 * everything that depends on d^n only (the
 * slots of the tetragonal spectrum, their cubic sources, the term names,
 * degeneracies) is built once per d^n; the label strings once per parent
 * table (a handful per d^n, parent-tables.ts); a call computes the
 * tetragonal block eigenvalues, orders the cubic lists it merges, merges the
 * sorted blocks of positions into a preallocated index array and makes one
 * object per level. The order of two cubic lists needs the eigenvalues of
 * one of them only (the shorter): the other is brought to tridiagonal form
 * and a Sturm count (sturm-count.ts) says how many of its levels lie below
 * each eigenvalue of the first, which saves its QL iteration, the larger
 * part of its cost.
 *
 * Where the time goes (issue 15's 2× is not met; measured at d5 with
 * bench/ligand-field.ts, Ds = 0.1 Dq, Dt = 0.05 Dq, as CPU-time ratios to one
 * labelled cubic call): the tetragonal eigenvalues 1.6–1.7× (the blocks are
 * already the smallest: one row of E, spin-adapted, 11 + 8 + 18 + 10 + 10
 * doublet states against the cubic 4 + 3 + 7 + 8 + 10), the parents
 * (tetragonalParentRanks) 0.4× (every cubic block a merge needs brought to
 * tridiagonal form, the shorter lists' QL), the rest (free-ion parent
 * table, sort, label strings, objects, validation) 0.3–0.6×. The first two
 * are a floor near 2.1× for this method. A shortcut that orders the merges
 * from the tetragonal eigenvalues alone (Weyl: when every gap of a merged
 * cubic list exceeds 2‖V‖, V the Ds, Dt part) holds for no d3–d7 parameter
 * set at the bench's distortion (bench weylShortcutShare), so it is not
 * used.
 *
 * The slow reference (a labelled computeLevels, then parents by rank) is
 * spinFreeTetragonalLevelsViaCubic in tetragonal-spin-free.ts, which also serves
 * Dq = 0; tests/ligand-field/tetragonal-levels.test.ts and
 * tetragonal-parent-order.test.ts (fine sweeps through cubic crossings,
 * where a wrong Sturm count would show) compare the two.
 */

/** D4 channel (CHANNEL_D4_IRREPS index) → the cubic irrep columns (A1, A2, E, T1, T2 = 0..4) that hold it. */
const CUBIC_SOURCES: readonly (readonly number[])[] = [[0, 2], [3], [3, 4], [1, 2], [4]];

const GERADE_D4H: readonly string[] = ['A1g', 'A2g', 'Eg', 'B1g', 'B2g'];

/** One (S, D4 channel) block of the tetragonal spectrum: its positions start..start+size−1, ranks 0..size−1. */
interface Slot {
  spinIndex: number;
  twoS: number;
  channel: number;
  start: number;
  size: number;
  /** Cubic columns merged into it (one or two). */
  first: number;
  second: number | undefined;
}

/**
 * A cubic (S, Γ) block a merge needs, with its per-call result: its ascending
 * eigenvalues ("values": the shorter list of some merge) or its scaled
 * tridiagonal form for Sturm counts ("tridiagonal": only ever the longer).
 */
interface CubicSource {
  spinIndex: number;
  column: number;
  size: number;
  mode: 'values' | 'tridiagonal';
  values: Float64Array;
  diagonal: Float64Array;
  offDiagonal: Float64Array;
  /** The power of two the tridiagonal is scaled by (symmetricTridiagonalInPlace). */
  factor: number;
}

/** What depends on d^n only. */
interface Plan {
  tetragonal: TetragonalBlocks;
  cubic: IrrepBlocks;
  slots: Slot[];
  count: number;
  /** Per position: "4A2g", "A2g", 2S+1 and the degeneracy. */
  term: string[];
  irrep: string[];
  multiplicity: Int32Array;
  degeneracy: Int32Array;
  /** Per call: the parent's cubic column and rank of each position, and the sorted order. */
  parentColumn: Int32Array;
  parentRank: Int32Array;
  /** The two arrays above, as tetragonalParentRanks returns them. */
  parents: TetragonalParentRanks;
  order: Int32Array;
  /** Largest cubic block, for the label index. */
  maxRank: number;
  /**
   * The cubic (spin index, column) blocks some merge needs: a slot with one
   * non-empty source takes its parents by rank and needs none (all of d1 and
   * d9, most blocks of d2 and d8).
   */
  needed: CubicSource[];
  /** sources[spinIndex][column]: the needed blocks (undefined: not needed). */
  sources: Array<Array<CubicSource | undefined>>;
  /** Run boundaries of the position blocks (slot starts, then count), and the merge buffers. */
  runs: Int32Array;
  buffer: Int32Array;
  scratch: Float64Array;
  eigen: EigenWorkspace;
  /** The last parent table and its label store: a fit-free caller keeps C/B, and a lookup is saved. */
  lastTable: ParentTable | undefined;
  lastStore: Array<string | undefined>;
}

const plans: Array<Plan | undefined> = [];

function planFor(d: number): Plan {
  const hit = plans[d];
  if (hit) return hit;
  const tetragonal = tetragonalBlocks(d);
  const cubic = irrepBlocks(d, 'octahedral');
  const slots: Slot[] = [];
  let start = 0;
  // The position order of tetragonal-spectrum.ts: highest spin first, then channel, then rank.
  for (let s = tetragonal.blocks.length - 1; s >= 0; s--)
    tetragonal.blocks[s]!.forEach((block, channel) => {
      if (block.size === 0) return;
      const [first, second] = CUBIC_SOURCES[channel]! as [number, number | undefined];
      const sources = cubic.blocks[s]![first]!.size + (second === undefined ? 0 : cubic.blocks[s]![second]!.size);
      if (sources !== block.size) {
        throw new FieldgapError('internal', `d${d}: tetragonal block ${tetragonal.twoSValues[s]! + 1}${CHANNEL_D4_IRREPS[channel]} has ${block.size} states, its cubic sources ${sources}`);
      }
      // A source that is empty leaves one list: parents by rank, no merge.
      const firstSize = cubic.blocks[s]![first]!.size;
      const merge = second !== undefined && firstSize > 0 && cubic.blocks[s]![second]!.size > 0;
      const only = second === undefined || firstSize > 0 ? first : second;
      slots.push({ spinIndex: s, twoS: tetragonal.twoSValues[s]!, channel, start, size: block.size, first: merge ? first : only, second: merge ? second : undefined });
      start += block.size;
    });
  const count = start;
  const sources: Array<Array<CubicSource | undefined>> = cubic.blocks.map((row) => row.map(() => undefined));
  const needed: CubicSource[] = [];
  const sourceOf = (s: number, column: number): CubicSource => {
    let source = sources[s]![column];
    if (!source) {
      const size = cubic.blocks[s]![column]!.size;
      source = {
        spinIndex: s, column, size, mode: 'tridiagonal', values: new Float64Array(size), diagonal: new Float64Array(size),
        offDiagonal: new Float64Array(Math.max(size, 1)), factor: 1,
      };
      sources[s]![column] = source;
      needed.push(source);
    }
    return source;
  };
  // The shorter list of each merge is diagonalised (ties: the first), the longer counted against it.
  for (const slot of slots)
    if (slot.second !== undefined) {
      const first = sourceOf(slot.spinIndex, slot.first);
      const second = sourceOf(slot.spinIndex, slot.second);
      (first.size <= second.size ? first : second).mode = 'values';
    }
  const largest = Math.max(1, ...needed.map(({ size }) => size));
  const runs = Int32Array.from([...slots.map((slot) => slot.start), count]);
  const parentColumn = new Int32Array(count);
  const parentRank = new Int32Array(count);
  const plan: Plan = {
    tetragonal, cubic, slots, count,
    term: new Array<string>(count), irrep: new Array<string>(count),
    multiplicity: new Int32Array(count), degeneracy: new Int32Array(count),
    parentColumn, parentRank, parents: { column: parentColumn, rank: parentRank }, order: new Int32Array(count),
    maxRank: Math.max(1, ...cubic.blocks.flat().map((b) => b.size)),
    needed, sources, runs, buffer: new Int32Array(count),
    scratch: new Float64Array(largest * largest),
    eigen: createEigenWorkspace(largest),
    lastTable: undefined,
    lastStore: [],
  };
  for (const slot of slots)
    for (let r = 0; r < slot.size; r++) {
      const p = slot.start + r;
      plan.irrep[p] = GERADE_D4H[slot.channel]!;
      plan.term[p] = `${slot.twoS + 1}${plan.irrep[p]}`;
      plan.multiplicity[p] = slot.twoS + 1;
      plan.degeneracy[p] = (slot.twoS + 1) * D4_DIMENSION[CHANNEL_D4_IRREPS[slot.channel]!];
    }
  plans[d] = plan;
  return plan;
}

/** Per parent table (fixed objects, parent-tables.ts): "4A2g[4T1g(F)]" by position, cubic column and rank, made on first use. */
const labelTables = new WeakMap<ParentTable, Map<number, Array<string | undefined>>>();

function labelStore(table: ParentTable, d: number, size: number): Array<string | undefined> {
  let byD = labelTables.get(table);
  if (!byD) labelTables.set(table, (byD = new Map()));
  let store = byD.get(d);
  // Filled to its full size at once: writes far beyond the end of an empty array would turn it into a slow dictionary.
  if (!store) byD.set(d, (store = Array.from({ length: size }, (): string | undefined => undefined)));
  return store;
}

/**
 * Merges the ascending cubic lists of one slot into the parent (column,
 * rank) of each of its positions. Ties within tol go to the first list (the
 * lower irrep column), as computeLevels orders them: the i-th level of the
 * first list comes after the levels of the second below first[i] − tol, the
 * j-th of the second after those of the first at or below second[j] + tol.
 * With one list as a tridiagonal, those numbers are its Sturm counts at the
 * other's eigenvalues (a count is kept monotone, so the merge stays a
 * permutation whatever the round-off).
 */
function mergeParents(slot: Slot, row: ReadonlyArray<CubicSource | undefined>, tol: number, column: Int32Array, rank: Int32Array): void {
  let p = slot.start;
  if (slot.second === undefined) {
    for (let i = 0; i < slot.size; i++, p++) {
      column[p] = slot.first;
      rank[p] = i;
    }
    return;
  }
  const a = row[slot.first]!;
  const b = row[slot.second]!;
  // The list given by eigenvalues leads; the other follows by counts (or by a plain merge when both have values).
  const lead = a.mode === 'values' ? a : b;
  const other = lead === a ? b : a;
  const leadColumn = lead.column;
  const otherColumn = other.column;
  // Offset of the threshold: the first list yields within tol, the second not.
  const offset = lead === a ? -tol : tol;
  const values = lead.values;
  let j = 0;
  for (let i = 0; i < lead.size; i++) {
    const threshold = values[i]! + offset;
    let below: number;
    if (other.mode === 'values') {
      below = j;
      const list = other.values;
      while (below < other.size && (lead === a ? list[below]! < threshold : list[below]! <= threshold)) below++;
    } else {
      below = tridiagonalCountBelow(other.diagonal, other.offDiagonal, other.size, threshold * other.factor);
    }
    for (; j < below; j++, p++) {
      column[p] = otherColumn;
      rank[p] = j;
    }
    column[p] = leadColumn;
    rank[p] = i;
    p++;
  }
  for (; j < other.size; j++, p++) {
    column[p] = otherColumn;
    rank[p] = j;
  }
}

/**
 * Stable merge of the ascending runs of positions (one per slot: runs holds
 * their starts, then count) into order, by energy: equal energies keep the
 * position order (higher spin, then channel), as a stable sort would.
 */
function orderPositions(energy: Float64Array, runs: Int32Array, count: number, order: Int32Array, buffer: Int32Array): void {
  for (let p = 0; p < count; p++) order[p] = p;
  let from = order;
  let to = buffer;
  // Bottom-up: merge runs k and k + width, doubling width, until one run is left.
  const last = runs.length - 1;
  for (let width = 1; width < last; width *= 2) {
    for (let k = 0; k < last; k += 2 * width) {
      const lo = runs[k]!;
      const mid = runs[Math.min(k + width, last)]!;
      const hi = runs[Math.min(k + 2 * width, last)]!;
      let i = lo;
      let j = mid;
      let out = lo;
      while (i < mid && j < hi) to[out++] = energy[from[j]!]! < energy[from[i]!]! ? from[j++]! : from[i++]!;
      while (i < mid) to[out++] = from[i++]!;
      while (j < hi) to[out++] = from[j++]!;
    }
    [from, to] = [to, from];
  }
  if (from !== order) order.set(from.subarray(0, count));
}

const cubicCoefficients = new Float64Array(3);
const coefficients = new Float64Array(5);

/** The cubic blocks the merges need at Dq, B, C: eigenvalues of the shorter list of each merge, the tridiagonal form of the longer. */
function evaluateCubicSources(plan: Plan, dq: number, b: number, c: number): void {
  cubicCoefficients[0] = dq;
  cubicCoefficients[1] = b;
  cubicCoefficients[2] = c;
  const { needed, scratch, eigen } = plan;
  for (let k = 0; k < needed.length; k++) {
    const source = needed[k]!;
    const block = plan.cubic.blocks[source.spinIndex]![source.column]!;
    blockHamiltonianInto(block, cubicCoefficients, scratch);
    if (source.mode === 'values') symmetricEigenvaluesInPlace(scratch, block.size, source.values, eigen);
    else source.factor = symmetricTridiagonalInPlace(scratch, block.size, source.diagonal, source.offDiagonal);
  }
}

/** Per tetragonal position (tetragonal-spectrum.ts order): its octahedral parent as a cubic irrep column (A1, A2, E, T1, T2 = 0..4) and rank. */
export interface TetragonalParentRanks {
  column: Int32Array;
  rank: Int32Array;
}

/**
 * The octahedral parent of every spin-free tetragonal level of d^n (1..9)
 * at Dq (≠ 0), B, C, by position (the order of tetragonal-spectrum.ts): the
 * part of a labelled evaluation that needs the cubic blocks. It does not
 * depend on Ds and Dt. The arrays belong to the per-d^n plan: valid until
 * the next call for the same d.
 */
export function tetragonalParentRanks(d: number, dq: number, b: number, c: number): TetragonalParentRanks {
  const plan = planFor(d);
  evaluateCubicSources(plan, dq, b, c);
  const mergeTol = energyTolerance({ dq, b, c });
  const { slots, sources, parentColumn, parentRank } = plan;
  for (let k = 0; k < slots.length; k++) {
    const slot = slots[k]!;
    mergeParents(slot, sources[slot.spinIndex]!, mergeTol, parentColumn, parentRank);
  }
  return plan.parents;
}

/**
 * The levels, ascending (ties: higher spin, then channel), energies from the
 * ground level (cm-1); tol (cm-1) zeroes round-off at the ground. dq ≠ 0:
 * at Dq = 0 the octahedral order of a term's components is that of the
 * limit Dq → 0 (levels.ts), which only computeLevels knows.
 */
export function tetragonalLevelsFast(d: number, dq: number, b: number, c: number, ds: number, dt: number, tol: number): FieldLevel[] {
  const plan = planFor(d);
  const { count, order, maxRank } = plan;
  const { column: parentColumn, rank: parentRank } = tetragonalParentRanks(d, dq, b, c);
  coefficients[0] = dq;
  coefficients[1] = b;
  coefficients[2] = c;
  coefficients[3] = ds;
  coefficients[4] = dt;
  const { energy } = tetragonalSpectrum(plan.tetragonal, coefficients);
  orderPositions(energy, plan.runs, count, order, plan.buffer);
  const table = parentTableFor(d, c / b);
  const names = table.labels('octahedral');
  if (plan.lastTable !== table) {
    plan.lastTable = table;
    plan.lastStore = labelStore(table, d, count * 5 * maxRank);
  }
  const store = plan.lastStore;
  const ground = energy[order[0]!]!;
  const levels = new Array<FieldLevel>(count);
  for (let k = 0; k < count; k++) {
    const i = order[k]!;
    const column = parentColumn[i]!;
    const rank = parentRank[i]!;
    const multiplicity = plan.multiplicity[i]!;
    const parent = names[5 * multiplicity + column]?.[rank];
    if (parent === undefined) throw new FieldgapError('internal', `no octahedral parent for tetragonal level ${plan.term[i]} (position ${i})`);
    const at = (i * 5 + column) * maxRank + rank;
    const label = (store[at] ??= `${plan.term[i]}[${parent}]`);
    const relative = energy[i]! - ground;
    levels[k] = {
      energy: relative < tol ? 0 : relative, degeneracy: plan.degeneracy[i]!, irrep: plan.irrep[i]!, parent, parentWeight: 1,
      term: plan.term[i]!, multiplicity, label,
    };
  }
  return levels;
}
