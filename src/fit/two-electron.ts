/**
 * Which transitions are "two-electron jumps, expected weak".
 *
 * A level whose strong-field configuration differs from the ground's by two
 * or more electrons (promotedElectrons, scan.ts) is weak only when nothing
 * lends it intensity. A level that shares irrep and multiplicity with a
 * one-electron level mixes with it through interelectronic repulsion and
 * borrows its intensity: 3T1g(P) of octahedral Ni(II) and 4T1(P) of
 * tetrahedral Co(II) are among the strongest bands of their spectra (common
 * practice). Only levels with no one-electron partner of the same symmetry
 * and spin (4A2g of high-spin octahedral Co(II), 3A2g of V(III)) keep the
 * label.
 */
import { promotedElectrons, type LevelScan } from './scan.js';

const cache = new WeakMap<LevelScan, Map<number, Uint8Array>>();

/** 1 for each ids index that is a two-electron jump from `ground` with no one-electron partner of its symmetry and spin. */
export function twoElectronLevels(scan: LevelScan, ground: number): Uint8Array {
  let perScan = cache.get(scan);
  if (!perScan) cache.set(scan, (perScan = new Map()));
  const hit = perScan.get(ground);
  if (hit) return hit;
  const promoted = promotedElectrons(scan, ground);
  const oneElectron = new Set<string>();
  scan.ids.forEach((id, k) => {
    if (k !== ground && Math.abs(promoted[k]!) <= 1) oneElectron.add(`${id.multiplicity}${id.irrep}`);
  });
  const flags = Uint8Array.from(scan.ids, (id, k) => (Math.abs(promoted[k]!) >= 2 && !oneElectron.has(`${id.multiplicity}${id.irrep}`) ? 1 : 0));
  perScan.set(ground, flags);
  return flags;
}
