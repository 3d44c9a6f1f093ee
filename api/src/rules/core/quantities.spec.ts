import { MEASURES_ML, toGrams } from './quantities';

describe('toGrams', () => {
  // NIST definitions (from memory): US gallon = 231 in^3 × 16.387064 cm^3 = 3785.411784 mL; cup = 1/16 gallon.
  it('uses the exact US customary cup, tablespoon and teaspoon', () => {
    expect(MEASURES_ML['us-customary'].cup).toBeCloseTo(3785.411784 / 16, 9);
    expect(MEASURES_ML['us-customary'].tbsp).toBeCloseTo(3785.411784 / 256, 9);
    expect(MEASURES_ML['us-customary'].tsp).toBeCloseTo(3785.411784 / 768, 9);
  });

  it.each([
    { qty: 250, unit: 'g' as const, item: {}, grams: 250 },
    { qty: 1.5, unit: 'kg' as const, item: {}, grams: 1500 },
    { qty: 100, unit: 'ml' as const, item: { gPerMl: 1.03 }, grams: 103 },
    { qty: 0.5, unit: 'l' as const, item: { gPerMl: 1 }, grams: 500 },
    { qty: 2, unit: 'tsp' as const, item: { gPerMl: 1 }, grams: 10 },
    { qty: 3, unit: 'each' as const, item: { gEach: 50 }, grams: 150 },
  ])('$qty $unit -> $grams g (metric measures)', ({ qty, unit, item, grams }) => {
    const r = toGrams(qty, unit, item, 'metric');
    expect(r).toEqual({ ok: true, grams });
  });

  it('says which figure is missing for a volume or a count', () => {
    expect(toGrams(1, 'cup', {}, 'metric')).toEqual({ ok: false, needs: 'gPerMl' });
    expect(toGrams(1, 'each', { gPerMl: 1 }, 'metric')).toEqual({ ok: false, needs: 'gEach' });
  });
});
