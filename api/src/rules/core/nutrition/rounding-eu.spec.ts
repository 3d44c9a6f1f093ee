import { euText } from './rounding-eu';

/*
 * European Commission, "Guidance document for competent authorities for the control of
 * compliance with EU legislation ... with regard to the setting of tolerances for nutrient
 * values declared on a label" (December 2012), rounding table: FROM MEMORY (the table itself
 * was not opened; check it against the guidance, section 6). "0 g" is printed only for a computed 0; a non-zero
 * negligible amount prints "<0.5 g" / "<0.1 g" / "<0.01 g" (Crumbproof's choice of the two
 * presentations the guidance allows).
 */
describe('EU label rounding (Commission guidance, December 2012, from memory)', () => {
  it.each([
    // Commission guidance (2012) rounding table, from memory: 12.46 g → 12 g (≥ 10 g: nearest 1 g);
    // 4.44 g → 4.4 g (nearest 0.1 g); 0.4 g → "<0.5 g" (0.5 g or less).
    { v: 12.46, text: '12 g' },
    { v: 4.44, text: '4.4 g' },
    { v: 0.4, text: '<0.5 g' },
    // ≥ 10 g → nearest 1 g; < 10 g → nearest 0.1 g: both sides of 10.
    { v: 10, text: '10 g' },
    { v: 10.4, text: '10 g' },
    { v: 9.94, text: '9.9 g' },
    // 9.96 is < 10 g, rounds to 10.0 at 0.1 g, printed at the ≥ 10 g precision (Crumbproof's decision).
    { v: 9.96, text: '10 g' },
    // > 0.5 g → nearest 0.1 g; ≤ 0.5 g → "<0.5 g": both sides of 0.5.
    { v: 0.51, text: '0.5 g' },
    { v: 0.56, text: '0.6 g' },
    { v: 0.5, text: '<0.5 g' },
    { v: 0.01, text: '<0.5 g' },
    { v: 0, text: '0 g' },
    { v: 57.6, text: '58 g' },
  ])('fat, carbohydrate, sugars, fibre, protein: $v g → "$text"', ({ v, text }) => {
    expect(euText('macro', v)).toBe(text);
  });

  it.each([
    // Same table, from memory: saturates 0.08 g → "<0.1 g" (or "0 g").
    { v: 0.08, text: '<0.1 g' },
    // ≤ 0.1 g / > 0.1 g
    { v: 0.1, text: '<0.1 g' },
    { v: 0.12, text: '0.1 g' },
    { v: 0.16, text: '0.2 g' },
    // < 10 g / ≥ 10 g
    { v: 9.94, text: '9.9 g' },
    { v: 9.96, text: '10 g' },
    { v: 10.6, text: '11 g' },
    { v: 0, text: '0 g' },
  ])('saturates: $v g → "$text"', ({ v, text }) => {
    expect(euText('saturates', v)).toBe(text);
  });

  it.each([
    // Same table, from memory: salt 0.3075 g (IFCT 2017 egg M001, sodium 0.123 g × 2.5, Regulation (EU)
    // No 1169/2011 Annex I point 11) → "0.31 g"; 1.234 g → "1.2 g"; 0.01 g → "<0.01 g".
    { v: 0.3075, text: '0.31 g' },
    { v: 1.234, text: '1.2 g' },
    { v: 0.01, text: '<0.01 g' },
    // ≤ 0.0125 g / > 0.0125 g
    { v: 0.0125, text: '<0.01 g' },
    { v: 0.0126, text: '0.01 g' },
    { v: 0.0151, text: '0.02 g' },
    // < 1 g → 0.01 g / ≥ 1 g → 0.1 g
    { v: 0.994, text: '0.99 g' },
    { v: 0.996, text: '1.0 g' },
    { v: 1, text: '1.0 g' },
    { v: 1.06, text: '1.1 g' },
    { v: 0, text: '0 g' },
  ])('salt: $v g → "$text"', ({ v, text }) => {
    expect(euText('salt', v)).toBe(text);
  });

  it.each([
    // Energy: nearest 1 kJ / 1 kcal.
    { kind: 'energyKj' as const, v: 1707.6, text: '1708 kJ' },
    { kind: 'energyKj' as const, v: 1708.4, text: '1708 kJ' },
    { kind: 'energyKcal' as const, v: 135.47, text: '135 kcal' },
    { kind: 'energyKcal' as const, v: 135.51, text: '136 kcal' },
  ])('$kind: $v → "$text"', ({ kind, v, text }) => {
    expect(euText(kind, v)).toBe(text);
  });

  it('prints a figure some ingredient lacks as "incomplete", never as 0', () => {
    expect(euText('macro', null)).toBe('incomplete');
    expect(euText('energyKj', null)).toBe('incomplete');
  });
});
