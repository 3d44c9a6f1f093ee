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

// The thresholds of every regime, at, above and below, are checked in thresholds.spec.ts.
describe('sulphites as eaten', () => {
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
    // 20 g × 500 mg/kg = 10 mg SO2 in 0.9 kg → 11.1111 mg/kg (six significant figures) > 10
    // (Regulation (EU) No 1169/2011 Annex II point 12, as proposed ready for consumption)
    const d = declare(b, 'loaf', refs);
    expect(d.sulphites.mgPerKg).toBe(11.1111);
    expect(d.sulphites.declared).toBe(true);
  });

  it('declares and warns when a sulphite source has no stated content (what cannot be computed is declared)', () => {
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
