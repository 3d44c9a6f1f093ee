/**
 * Rounds to `digits` decimals, half away from zero, avoiding binary artefacts (1.005 → 1.01):
 * for figures printed or compared as printed (percentages, concentrations). Nutrition on labels is
 * rounded to the regime's steps instead (the rules core's nutrition/round.ts).
 */
export function round(value: number, digits: number): number {
  const f = 10 ** digits;
  return (Math.sign(value) * Math.round(Math.abs(value) * f + 1e-9)) / f;
}
