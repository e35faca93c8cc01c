/**
 * Spin branches and the enumeration of band assignments on a level scan.
 *
 * A branch is an assumed ground level: every ground level that occurs along
 * the scan (one for d1–d3 and d8–d9 octahedral, two where a spin crossover
 * exists). Its points are the grid x where it is the ground level, so every
 * solution found on them is self-consistent. Its classes of transitions:
 * `allowed` (same multiplicity as the ground level) and `forbidden`
 * (multiplicity ±2). When a branch has no spin-allowed transition (high-spin
 * d5), the forbidden class takes all bands.
 *
 * An assignment maps the bands of each class, sorted by energy, to
 * transitions of that class in the same energy order: at some grid point the
 * bands take an increasing subsequence of that class's transitions sorted by
 * energy, of which only the lowest (bands + maxSkip) are considered (more
 * transitions skipped below the highest assigned one never win: each costs a
 * penalty). The table of assignments depends on the scan and the band counts,
 * not on the band positions, so it is cached.
 */
import { forEachCombination } from './combinations.js';
import type { LevelScan } from './scan.js';
import { twoElectronLevels } from './two-electron.js';

export interface Branch {
  /** ids index of the assumed ground level. */
  ground: number;
  multiplicity: number;
  /** Grid indices where this level is the ground level. */
  points: number[];
  /** ids indices of spin-allowed transitions (same multiplicity, ground excluded). */
  allowed: number[];
  /** ids indices of spin-forbidden (ΔS = ±1) transitions. */
  forbidden: number[];
}

/**
 * The branch's ground is the strong-field one: not the ground at the weakest
 * field of the scan (low-spin d4–d7 octahedral, d3–d6 tetrahedral). False for
 * an ion with one ground level throughout.
 */
export function isLowSpinBranch(scan: LevelScan, branch: Branch): boolean {
  return branch.ground !== scan.ground[0];
}

/**
 * The scan's branches, built once per scan (a scan is cached and never
 * changes, scan.ts): the same objects every call, so callers only read them.
 */
export function scanBranches(scan: LevelScan): readonly Branch[] {
  let branches = branchesOfScan.get(scan);
  if (branches === undefined) branchesOfScan.set(scan, (branches = scanBranchesUncached(scan)));
  return branches;
}

const branchesOfScan = new WeakMap<LevelScan, readonly Branch[]>();

function scanBranchesUncached(scan: LevelScan): Branch[] {
  const branches: Branch[] = [];
  scan.ground.forEach((g, j) => {
    let branch = branches.find((b) => b.ground === g);
    if (!branch) {
      const multiplicity = scan.ids[g]!.multiplicity;
      const allowed: number[] = [];
      const forbidden: number[] = [];
      scan.ids.forEach((id, k) => {
        if (k === g) return;
        if (id.multiplicity === multiplicity) allowed.push(k);
        else if (Math.abs(id.multiplicity - multiplicity) === 2) forbidden.push(k);
      });
      branch = { ground: g, multiplicity, points: [], allowed, forbidden };
      branches.push(branch);
    }
    branch.points.push(j);
  });
  return branches;
}

/** The transitions a branch offers to unflagged bands, and whether they are spin-forbidden. */
export function primaryClass(branch: Branch): { levels: number[]; forbidden: boolean } {
  return branch.allowed.length > 0 ? { levels: branch.allowed, forbidden: false } : { levels: branch.forbidden, forbidden: true };
}

export interface AssignmentTable {
  /** Row-major (assignment, band): ids index; primary bands first, then flagged ones. */
  levels: Int32Array;
  /** Bands per assignment. */
  width: number;
  count: number;
  /** For assignment a: grid points pointStart[a] ≤ p < pointStart[a+1] of `points`. */
  pointStart: Int32Array;
  points: Int32Array;
}

/** Class levels above the ground at grid point j, sorted by energy, the lowest `limit`. */
function lowestAt(scan: LevelScan, j: number, levels: number[], limit: number): number[] {
  const n = scan.ids.length;
  return levels
    .filter((k) => scan.energies[j * n + k]! > 1e-9)
    .sort((a, b) => scan.energies[j * n + a]! - scan.energies[j * n + b]!)
    .slice(0, limit);
}

const tables = new WeakMap<LevelScan, Map<string, AssignmentTable>>();
const twins = new WeakMap<LevelScan, Int32Array>();

/**
 * For each level, the lowest ids index whose energy equals it at every point
 * of the scan (itself when none): levels degenerate at every field, such as
 * 4A1g and 4Eg(G) of d5, both at 10B + 5C in the cubic model. One band may
 * lie on both; two distinct bands given one each are two maxima of one
 * position of the model, scored as a split band (score-terms.ts).
 */
export function degenerateTwins(scan: LevelScan): Int32Array {
  const hit = twins.get(scan);
  if (hit) return hit;
  const n = scan.ids.length;
  const nx = scan.x.length;
  const same = (a: number, b: number): boolean => {
    for (let j = 0; j < nx; j++) {
      const ea = scan.energies[j * n + a]!;
      const eb = scan.energies[j * n + b]!;
      if (!(Math.abs(ea - eb) <= 1e-7 * Math.max(1, Math.abs(ea)))) return false;
    }
    return true;
  };
  const out = Int32Array.from({ length: n }, (_, k) => k);
  for (let k = 0; k < n; k++) {
    for (let r = 0; r < k; r++) {
      if (out[r] === r && scan.ids[r]!.multiplicity === scan.ids[k]!.multiplicity && same(r, k)) {
        out[k] = r;
        break;
      }
    }
  }
  twins.set(scan, out);
  return out;
}


/**
 * The levels a band flagged spin-forbidden may take: the spin-forbidden ones,
 * and the two-electron spin-allowed ones (two-electron.ts: 4A2g of high-spin
 * octahedral Co(II), 3A2g of V(III)). The flag says "weak, well below the
 * spin-allowed bands" (a user's reading, or the spectrum stage's, which
 * judges by intensity only), and those spin-allowed transitions are weak in
 * just that way (common practice: ε about a tenth of the one-electron bands);
 * the intensity term (penalties.ts) then scores the band as two-electron.
 */
export function flaggedClass(scan: LevelScan, branch: Branch): number[] {
  if (primaryClass(branch).forbidden) return branch.forbidden;
  const two = twoElectronLevels(scan, branch.ground);
  return [...branch.forbidden, ...branch.allowed.filter((k) => two[k] === 1)];
}

/**
 * All order-consistent assignments of nPrimary unflagged bands to the
 * branch's primary class and nFlagged spin-forbidden-flagged bands to its
 * forbidden class and its weak spin-allowed levels (flaggedClass; when the primary class is itself forbidden the flagged
 * bands must be counted in nPrimary by the caller), with the grid points at
 * which each holds.
 */
export function enumerateAssignments(
  scan: LevelScan,
  branch: Branch,
  nPrimary: number,
  nFlagged: number,
  { maxSkip = 4, maxSkipFlagged = 6 } = {},
): AssignmentTable {
  const key = `${branch.ground}|${nPrimary}|${nFlagged}|${maxSkip}|${maxSkipFlagged}`;
  let perScan = tables.get(scan);
  if (!perScan) tables.set(scan, (perScan = new Map()));
  const hit = perScan.get(key);
  if (hit) return hit;

  const primary = primaryClass(branch);
  const byKey = new Map<string, { levels: number[]; points: number[] }>();
  const width = nPrimary + nFlagged;
  const weakClass = flaggedClass(scan, branch);
  for (const j of branch.points) {
    const a = lowestAt(scan, j, primary.levels, nPrimary + maxSkip);
    const f = nFlagged > 0 ? lowestAt(scan, j, weakClass, nFlagged + maxSkipFlagged) : [];
    forEachCombination(a.length, nPrimary, (ia) => {
      const head = Array.from(ia, (i) => a[i]!);
      forEachCombination(f.length, nFlagged, (jf) => {
        const levels = head.concat(Array.from(jf, (i) => f[i]!));
        if (nFlagged > 0 && new Set(levels).size !== levels.length) return;
        const k = levels.join(',');
        const entry = byKey.get(k);
        if (entry) entry.points.push(j);
        else byKey.set(k, { levels, points: [j] });
      });
    });
  }
  const entries = [...byKey.values()];
  const levels = new Int32Array(entries.length * width);
  const pointStart = new Int32Array(entries.length + 1);
  const points = new Int32Array(entries.reduce((s, e) => s + e.points.length, 0));
  let at = 0;
  entries.forEach((entry, a) => {
    levels.set(entry.levels, a * width);
    pointStart[a] = at;
    points.set(entry.points, at);
    at += entry.points.length;
  });
  pointStart[entries.length] = at;
  const table: AssignmentTable = { levels, width, count: entries.length, pointStart, points };
  perScan.set(key, table);
  return table;
}
