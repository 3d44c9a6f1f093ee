import type { DeclaredIngredient, Regime } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();
const names = (list: DeclaredIngredient[]): string[] => list.map((e) => e.name);

describe('ingredient list order and percentages', () => {
  it('orders by weight at the time of use, descending (EU 1169/2011 Art. 18; 21 CFR 101.4(a)(1))', () => {
    const b = book(
      [ing('sugar'), ing('flour'), ing('butter', { contains: ['milk'] })],
      [
        recipe('p', [
          ['sugar', 100],
          ['flour', 300],
          ['butter', 200],
        ]),
      ],
    );
    const d = declare(b, 'p', refs);
    expect(names(d.ingredients)).toEqual(['Flour', 'Butter', 'Sugar']);
    expect(d.ingredients.map((e) => e.percent)).toEqual([50, expect.closeTo(33.333, 3), expect.closeTo(16.667, 3)]);
  });

  it('keeps a sub-recipe under its own name with its ingredients in brackets in their own order (Annex VII Part E.1)', () => {
    const b = book(
      [
        ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
        ing('sugar'),
        ing('eggs', { name: 'Eggs', contains: ['egg'] }),
        ing('cream', { name: 'Double cream', contains: ['milk'] }),
      ],
      [
        recipe(
          'sponge',
          [
            ['sugar', 100],
            ['flour', 120],
            ['eggs', 150],
          ],
          { finishedWeightG: 330 },
        ),
        recipe(
          'cake',
          [
            ['sponge', 330],
            ['cream', 200],
          ],
          { name: 'Cake' },
        ),
      ],
    );
    const d = declare(b, 'cake', refs);
    expect(names(d.ingredients)).toEqual(['Sponge', 'Double cream']);
    expect(names(d.ingredients[0].children)).toEqual(['Eggs', 'Wheat flour', 'Sugar']);
    // the sponge's lines split its share of the mix (330 / 530) in proportion to its own mix
    const sponge = d.ingredients[0];
    expect(sponge.children.reduce((s, c) => s + c.percent, 0)).toBeCloseTo(sponge.percent, 9);
    expect(sponge.allergens).toEqual(['gluten', 'eggs']);
    expect(d.ingredientsText).toBe('Ingredients: Sponge (Eggs, Wheat flour, Sugar), Double cream (milk).');
  });

  it('keeps a sub-recipe under 2 % in brackets too, so no allergen is lost (Annex VII E.2; decision documented in ingredient-list.ts)', () => {
    const b = book(
      [ing('flour'), ing('praline', { name: 'Hazelnut praline paste', contains: ['hazelnut'] }), ing('sugar')],
      [
        recipe('crunch', [
          ['praline', 50],
          ['sugar', 50],
        ]),
        recipe('loaf', [
          ['flour', 990],
          ['crunch', 10],
        ]),
      ],
    );
    const d = declare(b, 'loaf', refs);
    expect(d.ingredients[1]).toMatchObject({ name: 'Crunch', percent: 1 });
    expect(d.ingredientsMarkdown).toBe('Ingredients: Flour, Crunch (**Hazelnut** praline paste, Sugar).');
    expect(d.contains.map((c) => c.allergen)).toEqual(['nuts']);
  });

  it('puts contact lines at the end of their level, with no weight', () => {
    const b = book(
      [ing('flour', { contains: ['wheat'] }), ing('oil', { name: 'Rapeseed oil' }), ing('sugar'), ing('dust', { name: 'Rice flour' })],
      [
        recipe('p', [
          { use: 'oil', qty: 2, unit: 'g', role: 'contact' },
          ['sugar', 10],
          ['flour', 300],
          { use: 'dust', qty: 5, unit: 'g', role: 'contact' },
        ]),
      ],
    );
    const d = declare(b, 'p', refs);
    expect(d.ingredients.map((e) => [e.name, e.role, e.percent])).toEqual([
      ['Flour', 'ingredient', expect.closeTo(96.774, 3)],
      ['Sugar', 'ingredient', expect.closeTo(3.226, 3)],
      ['Rapeseed oil', 'contact', 0],
      ['Rice flour', 'contact', 0],
    ]);
  });

  it('brings the allergens of a contact line (dusting flour) without weight', () => {
    const b = book(
      [ing('sugar'), ing('flour', { name: 'Wheat flour', contains: ['wheat'] })],
      [recipe('p', [['sugar', 100], { use: 'flour', qty: 5, unit: 'g', role: 'contact' }])],
    );
    const d = declare(b, 'p', refs);
    expect(d.contains).toEqual([expect.objectContaining({ allergen: 'gluten', via: [['p', 'flour']] })]);
    expect(d.mixWeightG).toBe(100);
  });
});

describe('added water (EU 1169/2011 Annex VII A.1)', () => {
  const bread = (regime: Regime) =>
    declare(
      book(
        [
          ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
          ing('water', { name: 'Water' }),
          ing('salt', { name: 'Salt' }),
          ing('yeast', { name: 'Yeast' }),
        ],
        [
          recipe(
            'bread',
            [
              ['flour', 600],
              ['water', 400],
              ['salt', 12],
              ['yeast', 12],
            ],
            { finishedWeightG: 900 },
          ),
        ],
        {},
        regime,
      ),
      'bread',
      refs,
    );

  it('check value 30: bread 900 g from flour 600, water 400, salt 12, yeast 12 → water 276 g (30.7 %) declared after flour', () => {
    const d = bread('EU');
    expect(names(d.ingredients)).toEqual(['Wheat flour', 'Water', 'Salt', 'Yeast']);
    const water = d.ingredients[1];
    expect(water.orderWeightG).toBeCloseTo(276, 9);
    expect(water.percent).toBeCloseTo(30.67, 2);
    // salt and yeast each 12 / 1024 of the mix, under 2 % (Annex VII A.6, from memory)
    expect(d.ingredients[2].percent).toBeLessThan(2);
  });

  it('check value 31: biscuit 900 g from flour 500, sugar 250, butter 200, water 50 → water need not be declared', () => {
    const d = declare(
      book(
        [ing('flour', { contains: ['wheat'] }), ing('sugar'), ing('butter', { contains: ['milk'] }), ing('water', { name: 'Water' })],
        [
          recipe(
            'biscuit',
            [
              ['flour', 500],
              ['sugar', 250],
              ['butter', 200],
              ['water', 50],
            ],
            { finishedWeightG: 900 },
          ),
        ],
      ),
      'biscuit',
      refs,
    );
    expect(names(d.ingredients)).toEqual(['Flour', 'Sugar', 'Butter']);
    expect(d.warnings.map((w) => w.code)).toContain('added-water-omitted');
  });

  it('recognises added water by the isWater flag as well as by name', () => {
    const d = declare(
      book(
        [ing('flour'), ing('aq', { name: 'Filtered water', isWater: true })],
        [
          recipe(
            'p',
            [
              ['flour', 500],
              ['aq', 20],
            ],
            { finishedWeightG: 500 },
          ),
        ],
      ),
      'p',
      refs,
    );
    expect(names(d.ingredients)).toEqual(['Flour']);
  });

  it('lists added water by the weight used where the regime has no such derogation (US: FDA Food Labeling Guide ch. IV Q5)', () => {
    const d = bread('US');
    expect(d.ingredients[1]).toMatchObject({ name: 'Water', orderWeightG: 400 });
  });
});
