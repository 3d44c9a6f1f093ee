import { decimalsOf, roundToStep } from './round';

/*
 * Crumbproof's tie rule: neither the European Commission's 2012 guidance on tolerances and
 * rounding nor 21 CFR 101.9 states how to round an exact half (as far as either was read), so
 * exact decimal halves round up. This checks
 * that convention, including halves that binary floating point cannot hold exactly.
 */
describe('roundToStep (Crumbproof convention: decimal halves round up)', () => {
  it.each([
    { v: 1.005, step: 0.01, r: 1.01 }, // 1.005 / 0.01 is 100.49999999999999 in binary
    { v: 4.45, step: 0.1, r: 4.5 },
    { v: 4.449, step: 0.1, r: 4.4 },
    { v: 32.5, step: 5, r: 35 },
    { v: 32.4, step: 5, r: 30 },
    { v: 0.3, step: 0.1, r: 0.3 },
    { v: 145, step: 10, r: 150 },
  ])('$v to $step → $r', ({ v, step, r }) => {
    expect(roundToStep(v, step)).toBe(r);
  });

  it('refuses negative or non-finite values', () => {
    expect(() => roundToStep(-1, 1)).toThrow();
    expect(() => roundToStep(Number.NaN, 1)).toThrow();
  });

  it.each([
    { step: 1, d: 0 },
    { step: 0.1, d: 1 },
    { step: 0.01, d: 2 },
    { step: 0.5, d: 1 },
    { step: 10, d: 0 },
  ])('decimals of $step = $d', ({ step, d }) => {
    expect(decimalsOf(step)).toBe(d);
  });
});
