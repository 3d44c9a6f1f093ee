import { round } from './round';

describe('round', () => {
  it.each([
    // Decimal halves written in the source, which binary arithmetic puts a hair below the half.
    { value: 1.005, digits: 2, rounded: 1.01 },
    { value: 2.675, digits: 2, rounded: 2.68 },
    { value: 0.285, digits: 2, rounded: 0.29 },
    { value: 12.5, digits: 0, rounded: 13 },
    // Half away from zero on both sides.
    { value: -12.5, digits: 0, rounded: -13 },
    { value: -1.005, digits: 2, rounded: -1.01 },
    // Either side of a half.
    { value: 33.3449, digits: 2, rounded: 33.34 },
    { value: 33.345, digits: 2, rounded: 33.35 },
    { value: 66.66666666666667, digits: 1, rounded: 66.7 },
    { value: 0, digits: 2, rounded: 0 },
  ])('$value to $digits decimals is $rounded', ({ value, digits, rounded }) => {
    expect(round(value, digits)).toBe(rounded);
  });
});
