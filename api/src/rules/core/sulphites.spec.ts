import type { Regime } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();

/** 100 g of apricots at `mg` mg/kg in a product of 1000 g finished weight → mg / 10 mg/kg. */
function apricotBar(apricotMgPerKg: number | undefined, regime: Regime) {
  const b = book(
    [
      ing('apricots', { name: 'Dried apricots', contains: ['sulphites'], sulphiteMgPerKg: apricotMgPerKg }),
      ing('oats', { name: 'Rolled oats', contains: ['oats'] }),
    ],
    [
      recipe(
        'bar',
        [
          ['apricots', 100],
          ['oats', 1000],
        ],
        { finishedWeightG: 1000, sale: { portionG: 50 } },
      ),
    ],
    {},
    regime,
  );
  return declare(b, 'bar', refs);
}

describe('sulphites as eaten', () => {
  it.each([
    // Check value 36 (DOMAIN.md): total SO2 10 mg/kg as consumed.
    // EU 1169/2011 Annex II point 12: "more than 10 mg/kg" → not declared at exactly 10.
    { regime: 'EU' as const, mg: 100, declared: false },
    { regime: 'UK' as const, mg: 100, declared: false },
    // Canada FDR B.01.010.1: 10 p.p.m. or more → declared.
    { regime: 'CA' as const, mg: 100, declared: true },
    // FSANZ Schedule 9 / PEAL: 10 mg/kg or more → declared.
    { regime: 'ANZ' as const, mg: 100, declared: true },
    // US 21 CFR 101.100(a)(4): 10 ppm or more (from memory).
    { regime: 'US' as const, mg: 100, declared: true },
    // Just above and below the threshold.
    { regime: 'EU' as const, mg: 101, declared: true },
    { regime: 'CA' as const, mg: 99, declared: false },
  ])('$regime, apricots at $mg mg/kg (product 10x diluted): declared $declared', ({ regime, mg, declared }) => {
    const d = apricotBar(mg, regime);
    expect(d.sulphites.mgPerKg).toBeCloseTo(mg / 10, 9);
    expect(d.sulphites.declared).toBe(declared);
    const group = refs.regimes[regime].sulphites.group;
    if (group) expect(d.contains.some((c) => c.allergen === group)).toBe(declared);
  });

  it('computes on the weight after baking (concentration rises with moisture loss)', () => {
    const b = book(
      [ing('apricots', { contains: ['sulphites'], sulphiteMgPerKg: 500 }), ing('flour', { contains: ['wheat'] }), ing('water')],
      [
        recipe(
          'loaf',
          [
            ['apricots', 20],
            ['flour', 600],
            ['water', 400],
          ],
          { finishedWeightG: 900 },
        ),
      ],
    );
    // 20 g × 500 mg/kg = 10 mg SO2 in 0.9 kg → 11.1 mg/kg > 10 (EU Annex II point 12, as ready for consumption)
    const d = declare(b, 'loaf', refs);
    expect(d.sulphites.mgPerKg).toBeCloseTo(10 / 0.9, 9);
    expect(d.sulphites.declared).toBe(true);
  });

  it('declares and warns when a sulphite source has no stated content (what cannot be proved is not called safe)', () => {
    const d = apricotBar(undefined, 'EU');
    expect(d.sulphites).toEqual({ mgPerKg: null, declared: true });
    expect(d.contains.map((c) => c.allergen)).toContain('sulphites');
    expect(d.warnings).toEqual(expect.arrayContaining([expect.objectContaining({ code: 'sulphites-unstated', ingredient: 'apricots' })]));
  });

  it('gives no figure when a leaf has no allergen statement and no stated content', () => {
    const b = book(
      [ing('mix', { contains: undefined }), ing('apricots', { contains: ['sulphites'], sulphiteMgPerKg: 1000 })],
      [
        recipe('p', [
          ['mix', 900],
          ['apricots', 100],
        ]),
      ],
    );
    expect(declare(b, 'p', refs).sulphites).toEqual({ mgPerKg: null, declared: true });
  });

  it('counts a stated content even when the allergen list leaves sulphites out', () => {
    const b = book(
      [ing('wine', { sulphiteMgPerKg: 150 }), ing('sugar')],
      [
        recipe('syrup', [
          ['wine', 100],
          ['sugar', 100],
        ]),
      ],
    );
    const d = declare(b, 'syrup', refs);
    expect(d.sulphites.mgPerKg).toBeCloseTo(75, 9);
    expect(d.contains.map((c) => c.allergen)).toEqual(['sulphites']);
  });

  it('names sulphites in the US ingredient list (no US allergen group)', () => {
    const d = apricotBar(200, 'US');
    expect(d.contains).toEqual([]);
    expect(d.ingredientsText).toContain('Dried apricots (sulfites)');
  });
});
