import { invalidArgument } from '../errors.js';
import type { OrbitalField } from './orbital-field.js';

/**
 * The angular overlap model (AOM; Schäffer and Jørgensen): a field from the
 * ligands' positions, each ligand L contributing
 *   e_σ(L)·F_σ F_σᵀ + e_π(L)·(F_π1 F_π1ᵀ + F_π2 F_π2ᵀ)
 * to the OrbitalField (real d orbitals z², xz, yz, x²−y², xy; cm-1), F the
 * angular overlap factors of the five orbitals with a σ or π ligand orbital
 * along the ligand's direction n (unit vector from the metal):
 *   F_σ(k) = nᵀ Q_k n,   F_π(k) = (2/√3) uᵀ Q_k n   (u ⟂ n, unit),
 * Q_k the symmetric 3×3 forms of the normalised real d functions on the unit
 * sphere, scaled so a ligand on z has F_σ(z²) = 1 and F_π(xz) = 1 for u = x:
 *   z²: diag(−½, −½, 1); x²−y²: (√3/2)·diag(1, −1, 0);
 *   xz, yz, xy: (√3/2)·(e_a e_bᵀ + e_b e_aᵀ).
 * π bonding is taken as isotropic about the M–L axis (linearly ligating
 * ligands): the two π directions are any orthonormal pair ⟂ n, and the sum
 * does not depend on the pair. The field is not barycentred (its trace is
 * 2Σe_σ… + 4Σe_π…): only differences reach the spectrum.
 * Octahedral ML6: e_g at 3e_σ, t2g at 4e_π, so 10Dq = 3e_σ − 4e_π;
 * tetrahedral ML4: e at (8/3)e_π, t2 at (4/3)e_σ + (8/9)e_π, so
 * E(t2) − E(e) = (4/9)(3e_σ − 4e_π) (tests/ligand-field/orbital-field.test.ts).
 */
export interface AngularOverlapLigand {
  /** Position relative to the metal (any length > 0; only the direction counts). */
  x: number;
  y: number;
  z: number;
  /** σ antibonding parameter, cm-1. */
  eSigma: number;
  /** π parameter, cm-1 (positive for a π donor, negative for a π acceptor). Default 0. */
  ePi?: number | undefined;
}

const R3 = Math.sqrt(3) / 2;

/** The five Q_k as row-major 3×3, orbital order z², xz, yz, x²−y², xy. */
const Q: readonly (readonly number[])[] = [
  [-0.5, 0, 0, 0, -0.5, 0, 0, 0, 1],
  [0, 0, R3, 0, 0, 0, R3, 0, 0],
  [0, 0, 0, 0, 0, R3, 0, R3, 0],
  [R3, 0, 0, 0, -R3, 0, 0, 0, 0],
  [0, R3, 0, R3, 0, 0, 0, 0, 0],
];

function form(q: readonly number[], a: readonly number[], b: readonly number[]): number {
  let sum = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) sum += a[i]! * q[i * 3 + j]! * b[j]!;
  return sum;
}

/** Two unit vectors ⟂ n and to each other. */
function perpendicularPair(n: readonly number[]): [number[], number[]] {
  // Start from the axis least aligned with n, so the cross product is well conditioned.
  const axis = Math.abs(n[0]!) < 0.6 ? [1, 0, 0] : Math.abs(n[1]!) < 0.6 ? [0, 1, 0] : [0, 0, 1];
  const cross = (a: readonly number[], b: readonly number[]): number[] => [
    a[1]! * b[2]! - a[2]! * b[1]!, a[2]! * b[0]! - a[0]! * b[2]!, a[0]! * b[1]! - a[1]! * b[0]!,
  ];
  const u = cross(n, axis);
  const length = Math.hypot(u[0]!, u[1]!, u[2]!);
  const u1 = u.map((v) => v / length);
  return [u1, cross(n, u1)];
}

/** The angular overlap factors of the five real d orbitals for a σ and the two π ligand orbitals along n. */
export function angularOverlapFactors(n: readonly number[]): { sigma: number[]; pi: [number[], number[]] } {
  const [u1, u2] = perpendicularPair(n);
  return {
    sigma: Q.map((q) => form(q, n, n)),
    pi: [Q.map((q) => (2 / Math.sqrt(3)) * form(q, u1, n)), Q.map((q) => (2 / Math.sqrt(3)) * form(q, u2, n))],
  };
}

/** The OrbitalField of a set of ligands; each bad ligand is named by its index (ligands[i].field). */
export function angularOverlapField(ligands: readonly AngularOverlapLigand[]): OrbitalField {
  const field = new Float64Array(25);
  ligands.forEach((ligand, index) => {
    const { x, y, z, eSigma, ePi = 0 } = ligand;
    for (const [name, value] of [['x', x], ['y', y], ['z', z], ['eSigma', eSigma], ['ePi', ePi]] as const) {
      if (!Number.isFinite(value)) throw invalidArgument(`ligands[${index}].${name}`, 'a finite number is needed');
    }
    const length = Math.hypot(x, y, z);
    if (!(length > 0)) throw invalidArgument(`ligands[${index}]`, 'the ligand sits on the metal: give its position relative to the metal');
    const { sigma, pi } = angularOverlapFactors([x / length, y / length, z / length]);
    for (let i = 0; i < 5; i++)
      for (let j = 0; j < 5; j++) {
        field[i * 5 + j] = field[i * 5 + j]! + eSigma * sigma[i]! * sigma[j]! + ePi * (pi[0][i]! * pi[0][j]! + pi[1][i]! * pi[1][j]!);
      }
  });
  return field;
}
