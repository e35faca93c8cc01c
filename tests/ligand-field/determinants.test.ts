import { describe, expect, it } from 'vitest';
import {
  bitMl, dShellMasks, excitationSign, maskC4Label, maskMl, maskTwoMs, signBelow,
} from '../../src/ligand-field/determinants.js';

const binomial = (n: number, k: number): number => (k === 0 ? 1 : (binomial(n - 1, k - 1) * n) / k);

describe('d^n determinants as 10-bit masks', () => {
  it.each([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10])('d%i has C(10, n) determinants', (n) => {
    const masks = dShellMasks(n);
    expect(masks.length).toBe(binomial(10, n));
    expect(new Set(masks).size).toBe(masks.length);
  });

  it('follows the documented bit order', () => {
    expect([0, 1, 2, 3, 4].map(bitMl)).toEqual([-2, -1, 0, 1, 2]);
    expect([5, 6, 7, 8, 9].map(bitMl)).toEqual([-2, -1, 0, 1, 2]);
    expect(maskTwoMs(0b0000010001)).toBe(2); // |−2α, +2α>
    expect(maskMl(0b0000010001)).toBe(0);
    expect(maskMl(0b1000010000)).toBe(4); // |+2α, +2β>
    expect(maskC4Label(0b1000010000)).toBe(0);
    expect(maskC4Label(0b0000001000)).toBe(1); // m_l = +1
    expect(maskC4Label(0b0000000010)).toBe(3); // m_l = −1
  });

  it('signs: moving past occupied orbitals', () => {
    expect(signBelow(0b0111, 3)).toBe(-1);
    expect(signBelow(0b0011, 3)).toBe(1);
    // a†3 a0 |0 1>: a0 passes nothing (+1), a†3 passes bit 1 (−1).
    expect(excitationSign(0b0011, 3, 0)).toBe(-1);
    // a†0 a2 |0 1 2> = 0: bit 0 is still occupied.
    expect(excitationSign(0b0111, 0, 2)).toBe(0);
    // a†1 a2 |0 2>: a2 passes bit 0 (−1), a†1 passes bit 0 (−1): +1.
    expect(excitationSign(0b0101, 1, 2)).toBe(1);
  });

  it('a†p a_q agrees with applying the two operators one by one', () => {
    // a_q |mask> = (−1)^(bits below q) |mask − q>; a†p |m> = (−1)^(bits below p) |m + p>.
    for (const mask of dShellMasks(4))
      for (let p = 0; p < 10; p++)
        for (let q = 0; q < 10; q++) {
          let expected = 0;
          if (mask & (1 << q)) {
            const removed = mask & ~(1 << q);
            if (!(removed & (1 << p))) expected = signBelow(mask, q) * signBelow(removed, p);
          }
          expect(excitationSign(mask, p, q)).toBe(expected);
        }
  });
});
