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
    expect(d.contains).toEqual([expect.objectContaining({ allergen: 'gluten', via: [['p', 'flour']], contactVia: [['p', 'flour']] })]);
    expect(d.mixWeightG).toBe(100);
  });

  // Regulation (EU) No 1169/2011 Art. 9(1)(c) and Art. 21: an allergen in the food is declared
  // under contains, however it got there; a contact line never turns it into a may-contain.
  it('declares a contact line with no quantity under contains, never as a may-contain, and weighs nothing for it', () => {
    const b = book(
      [ing('batter', { name: 'Oat batter', vegan: true }), ing('butter', { name: 'Butter', contains: ['milk'], vegan: false })],
      [recipe('pancake', [['batter', 200], { use: 'butter', role: 'contact' }])],
    );
    const d = declare(b, 'pancake', refs);
    expect(d.contains).toEqual([
      expect.objectContaining({ allergen: 'milk', via: [['pancake', 'butter']], contactVia: [['pancake', 'butter']] }),
    ]);
    expect(d.mayContain).toEqual([]);
    expect(d.mixWeightG).toBe(200);
    expect(d.ingredients.map((e) => [e.name, e.role, e.percent])).toEqual([
      ['Oat batter', 'ingredient', 100],
      ['Butter', 'contact', 0],
    ]);
    expect(d.claims.vegan.status).not.toBe('holds');
  });

  it('never counts a quantity given to a contact line toward the mix or the percentages', () => {
    const weighed = (qty?: number) =>
      declare(
        book(
          [ing('sugar'), ing('flour', { name: 'Wheat flour', contains: ['wheat'] })],
          [recipe('p', [['sugar', 100], { use: 'flour', role: 'contact', ...(qty ? { qty, unit: 'g' as const } : {}) }])],
        ),
        'p',
        refs,
      );
    expect(weighed(50).mixWeightG).toBe(100);
    expect(weighed(50).ingredients).toEqual(weighed().ingredients);
  });

  it('lists an ingredient used in the mix and also by contact once, in its place by weight', () => {
    const b = book(
      [
        ing('flour', { name: 'Plain flour', contains: ['wheat'] }),
        ing('sugar', { name: 'Sugar' }),
        ing('butter', { name: 'Butter', contains: ['milk'] }),
      ],
      [recipe('loaf', [{ use: 'flour', role: 'contact' }, ['sugar', 300], ['flour', 200], ['butter', 100]])],
    );
    const d = declare(b, 'loaf', refs);
    expect(d.ingredients.map((e) => [e.name, e.role])).toEqual([
      ['Sugar', 'ingredient'],
      ['Plain flour', 'ingredient'],
      ['Butter', 'ingredient'],
    ]);
    expect(d.ingredientsMarkdown).toBe('Ingredients: Sugar, Plain flour (**wheat**), Butter (**milk**).');
    // Both uses are paths to the allergen; only the tin's is through contact.
    expect(d.contains.find((c) => c.allergen === 'gluten')).toMatchObject({ via: [['loaf', 'flour']], contactVia: [['loaf', 'flour']] });
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

  it('bread 900 g from flour 600, water 400, salt 12, yeast 12 → water 900 − 624 = 276 g (30.7 %) declared after flour', () => {
    const d = bread('EU');
    expect(names(d.ingredients)).toEqual(['Wheat flour', 'Water', 'Salt', 'Yeast']);
    const water = d.ingredients[1];
    expect(water.orderWeightG).toBeCloseTo(276, 9);
    expect(water.percent).toBeCloseTo(30.67, 2);
    // salt and yeast each 12 / 1024 of the mix, under 2 % (Annex VII A.6, from memory)
    expect(d.ingredients[2].percent).toBeLessThan(2);
  });

  it('biscuit 900 g from flour 500, sugar 250, butter 200, water 50 → 900 − 950 < 0, water need not be declared', () => {
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

describe('added water in a sub-recipe (Regulation (EU) No 1169/2011 Annex VII Part A point 1)', () => {
  /*
   * Choux paste, kept as its own unbaked sub-recipe: water 250 g, butter 100 g, flour 150 g,
   * eggs 250 g (750 g; other ingredients 500 g). Choux buns: paste 750 g + pearl sugar 50 g
   * (800 g), baked to `finishedG`. The paste has no finished weight of its own, so it loses the
   * buns' bake loss: as baked it weighs 750 × finished / 800, and its added water is that weight
   * minus the 500 g of other ingredients used.
   */
  const buns = (finishedG: number, regime: Regime = 'EU') =>
    declare(
      book(
        [
          ing('water', { name: 'Water' }),
          ing('butter', { name: 'Butter', contains: ['milk'] }),
          ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
          ing('eggs', { name: 'Eggs', contains: ['egg'] }),
          ing('pearl-sugar', { name: 'Pearl sugar' }),
        ],
        [
          recipe(
            'choux',
            [
              ['water', 250],
              ['butter', 100],
              ['flour', 150],
              ['eggs', 250],
            ],
            { name: 'Choux paste' },
          ),
          recipe(
            'buns',
            [
              ['choux', 750],
              ['pearl-sugar', 50],
            ],
            { name: 'Choux buns', finishedWeightG: finishedG },
          ),
        ],
        {},
        regime,
      ),
      'buns',
      refs,
    );

  it('places the water of an unbaked paste by what is left of it after the product is baked', () => {
    // Baked to 600 g: the paste as baked is 750 × 600 / 800 = 562.5 g; water 562.5 − 500 = 62.5 g,
    // 11.1 % of the paste (more than 5 %), so it is listed, after the butter (100 g), not first.
    // Its percent: the paste's share of the mix (750 / 800 = 93.75 %) × 62.5 / 562.5 = 10.42 %.
    const d = buns(600);
    const paste = d.ingredients[0];
    expect(names(paste.children)).toEqual(['Eggs', 'Wheat flour', 'Butter', 'Water']);
    const water = paste.children[3];
    expect(water.orderWeightG).toBeCloseTo(62.5, 9);
    expect(water.percent).toBeCloseTo(10.417, 3);
    expect(d.ingredientsText).toBe('Ingredients: Choux paste (Eggs, Wheat flour, Butter (milk), Water), Pearl sugar.');
  });

  it('leaves it out when what is left is at most 5 % of the paste as baked', () => {
    // Baked to 540 g: paste 750 × 540 / 800 = 506.25 g; water 506.25 − 500 = 6.25 g = 1.2 %.
    const d = buns(540);
    expect(names(d.ingredients[0].children)).toEqual(['Eggs', 'Wheat flour', 'Butter']);
    expect(d.warnings).toContainEqual(
      expect.objectContaining({
        code: 'added-water-omitted',
        ingredient: 'water',
        message: expect.stringContaining('about 1.2 % of Choux paste baked as part of Choux buns as finished is added water'),
      }),
    );
  });

  it('lists it by the weight used where the regime has no such derogation (US: FDA Food Labeling Guide ch. IV Q5)', () => {
    // 250 g of water at the time of use, level with the eggs and first in line order.
    const paste = buns(540, 'US').ingredients[0];
    expect(names(paste.children)).toEqual(['Water', 'Eggs', 'Wheat flour', 'Butter']);
    expect(paste.children[0].orderWeightG).toBe(250);
  });

  it('keeps a sub-recipe with a finished weight of its own on its own bake loss, not the product’s', () => {
    // Syrup: sugar 100 g + water 100 g, boiled down to 150 g (its own finished weight): water
    // 150 − 100 = 50 g, 33.3 % of the syrup, listed after the sugar. The sponge's bake loss
    // (500 g baked to 400 g) is not applied to it: that would give 150 × 0.8 − 100 = 20 g.
    // Percent: the syrup's share (150 / 500 = 30 %) × 50 / 150 = 10 %.
    const d = declare(
      book(
        [
          ing('sugar', { name: 'Sugar' }),
          ing('water', { name: 'Water' }),
          ing('flour', { name: 'Flour' }),
          ing('eggs', { name: 'Eggs', contains: ['egg'] }),
        ],
        [
          recipe(
            'syrup',
            [
              ['sugar', 100],
              ['water', 100],
            ],
            { name: 'Syrup', finishedWeightG: 150 },
          ),
          recipe(
            'sponge',
            [
              ['flour', 200],
              ['syrup', 150],
              ['eggs', 150],
            ],
            { name: 'Syrup sponge', finishedWeightG: 400 },
          ),
        ],
      ),
      'sponge',
      refs,
    );
    const syrup = d.ingredients.find((e) => e.id === 'syrup')!;
    expect(names(syrup.children)).toEqual(['Sugar', 'Water']);
    expect(syrup.children[1].orderWeightG).toBeCloseTo(50, 9);
    expect(syrup.children[1].percent).toBeCloseTo(10, 9);
  });

  it('takes the bake loss of the nearest recipe above that has a finished weight', () => {
    // Dough (unbaked): flour 600 g, water 400 g, salt 12 g, yeast 12 g (1024 g), baked as
    // "Bases" to 900 g; the pizza (bases 900 g + tomato 300 g) has no finished weight. The dough
    // loses the bases' loss (900 / 1024), not the pizza's (none): water 900 − 624 = 276 g,
    // 30.7 % of the dough as baked, listed after the flour (the bread above, one level down).
    const d = declare(
      book(
        [
          ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
          ing('water', { name: 'Water' }),
          ing('salt', { name: 'Salt' }),
          ing('yeast', { name: 'Yeast' }),
          ing('tomato', { name: 'Tomato' }),
        ],
        [
          recipe(
            'dough',
            [
              ['flour', 600],
              ['water', 400],
              ['salt', 12],
              ['yeast', 12],
            ],
            { name: 'Dough' },
          ),
          recipe('bases', [['dough', 1024]], { name: 'Bases', finishedWeightG: 900 }),
          recipe(
            'pizza',
            [
              ['bases', 900],
              ['tomato', 300],
            ],
            { name: 'Pizza' },
          ),
        ],
      ),
      'pizza',
      refs,
    );
    const dough = d.ingredients[0].children[0];
    expect(names(dough.children)).toEqual(['Wheat flour', 'Water', 'Salt', 'Yeast']);
    expect(dough.children[1].orderWeightG).toBeCloseTo(276, 9);
  });
});
