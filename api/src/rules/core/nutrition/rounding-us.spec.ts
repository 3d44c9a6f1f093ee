import { percentDvText, usText } from './rounding-us';

/*
 * 21 CFR 101.9(c)(1)–(7) and FDA "Guidance for Industry: A Food Labeling Guide", Appendix H,
 * "Rounding the Values According to FDA Rounding Rules" (paragraph numbers of 101.9(c) from
 * memory). Exact ties (x.5 of a step) are kept out of these tables.
 */
describe('US label rounding per serving (21 CFR 101.9(c), FDA Labeling Guide Appendix H)', () => {
  it.each([
    // 21 CFR 101.9(c)(1) and Appendix H: calories 4 → 0; 47 → 45; 48 → 50; 114 → 110; 116 → 120.
    { v: 4, text: '0' },
    { v: 47, text: '45' },
    { v: 48, text: '50' },
    { v: 114, text: '110' },
    { v: 116, text: '120' },
    // < 5 → 0 / ≥ 5 → nearest 5
    { v: 4.9, text: '0' },
    { v: 5, text: '5' },
    // ≤ 50 → nearest 5 / > 50 → nearest 10 (53 would be 55 at 5-cal steps)
    { v: 50, text: '50' },
    { v: 53, text: '50' },
    { v: 56, text: '60' },
  ])('calories (c)(1): $v → $text', ({ v, text }) => {
    expect(usText('calories', v)).toBe(text);
  });

  it.each([
    // 21 CFR 101.9(c)(2) and Appendix H: fat 0.4 g → 0 g; 4.7 → 4.5 g; 4.8 → 5 g; 5.4 → 5 g.
    { v: 0.4, text: '0 g' },
    { v: 4.7, text: '4.5 g' },
    { v: 4.8, text: '5 g' },
    { v: 5.4, text: '5 g' },
    // < 0.5 → 0 / ≥ 0.5 → nearest 0.5
    { v: 0.49, text: '0 g' },
    { v: 0.5, text: '0.5 g' },
    { v: 0.7, text: '0.5 g' },
    // < 5 → nearest 0.5 / ≥ 5 → nearest 1 (5.3 would be 5.5 at 0.5 g steps; 4.6 would be 5 at 1 g)
    { v: 4.6, text: '4.5 g' },
    { v: 5.3, text: '5 g' },
    { v: 12.6, text: '13 g' },
  ])('total, saturated and trans fat (c)(2): $v g → $text', ({ v, text }) => {
    expect(usText('fat', v)).toBe(text);
  });

  it.each([
    // 21 CFR 101.9(c)(3) and Appendix H (cholesterol): 1 → 0; 3 → less than 5 mg; 12 → 10 mg.
    { v: 1, text: '0 mg' },
    { v: 3, text: 'less than 5 mg' },
    { v: 12, text: '10 mg' },
    // < 2 → 0 / 2–5 → "less than 5 mg" / > 5 → nearest 5
    { v: 1.9, text: '0 mg' },
    { v: 2, text: 'less than 5 mg' },
    { v: 5, text: 'less than 5 mg' },
    { v: 6, text: '5 mg' },
    { v: 8, text: '10 mg' },
  ])('cholesterol (c)(3): $v mg → $text', ({ v, text }) => {
    expect(usText('cholesterol', v)).toBe(text);
  });

  it.each([
    // 21 CFR 101.9(c)(4) and Appendix H: sodium 3 mg → 0; 137 → 135; 140 → 140; 142 → 140; 146 → 150.
    { v: 3, text: '0 mg' },
    { v: 137, text: '135 mg' },
    { v: 140, text: '140 mg' },
    { v: 142, text: '140 mg' },
    { v: 146, text: '150 mg' },
    // < 5 → 0 / ≥ 5 → nearest 5
    { v: 4.9, text: '0 mg' },
    { v: 5, text: '5 mg' },
    // ≤ 140 → nearest 5 / > 140 → nearest 10 (143 would be 145 at 5 mg steps)
    { v: 143, text: '140 mg' },
  ])('sodium (c)(4): $v mg → $text', ({ v, text }) => {
    expect(usText('sodium', v)).toBe(text);
  });

  it.each([
    // 21 CFR 101.9(c)(6) and Appendix H (carbohydrate): 0.3 → 0 g; 0.7 → less than 1 g; 12.4 → 12 g.
    { v: 0.3, text: '0 g' },
    { v: 0.7, text: 'less than 1 g' },
    { v: 12.4, text: '12 g' },
    // < 0.5 / ≥ 0.5; < 1 / ≥ 1
    { v: 0.49, text: '0 g' },
    { v: 0.5, text: 'less than 1 g' },
    { v: 0.99, text: 'less than 1 g' },
    { v: 1, text: '1 g' },
    { v: 1.6, text: '2 g' },
  ])('carbohydrate, fibre, sugars, added sugars (c)(6): $v g → $text', ({ v, text }) => {
    expect(usText('carbohydrate', v)).toBe(text);
  });

  it.each([
    // 21 CFR 101.9(c)(7) and Appendix H: protein 0.7 g → "less than 1 g" (or "1 g"; Crumbproof prints the first).
    { v: 0.7, text: 'less than 1 g' },
    { v: 0.49, text: '0 g' },
    { v: 0.5, text: 'less than 1 g' },
    { v: 1.2, text: '1 g' },
    { v: 7.51, text: '8 g' },
  ])('protein (c)(7): $v g → $text', ({ v, text }) => {
    expect(usText('protein', v)).toBe(text);
  });

  it.each([
    // %DV: nearest 1 % (Appendix H).
    { v: 23.49, text: '23%' },
    { v: 23.51, text: '24%' },
    { v: 0.4, text: '0%' },
  ])('%DV $v → $text', ({ v, text }) => {
    expect(percentDvText(v)).toBe(text);
  });

  it('prints an unknown amount as "incomplete"', () => {
    expect(usText('sodium', null)).toBe('incomplete');
    expect(percentDvText(null)).toBe('incomplete');
  });
});
