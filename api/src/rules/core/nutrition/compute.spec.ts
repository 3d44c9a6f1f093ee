import { Book, BookInput, bookSchema, Nutrition } from '@crumbproof/shared';
import { computeNutrition } from './index';

type IngredientInput = BookInput['ingredients'][number];
type RecipeInput = BookInput['recipes'][number];

function ing(id: string, nutrition?: Nutrition, extra: Partial<IngredientInput> = {}): IngredientInput {
  return { id, name: id.replace(/-/g, ' '), vegan: null, vegetarian: null, nutrition, ...extra };
}

function book(ingredients: IngredientInput[], recipes: RecipeInput[]): Book {
  return bookSchema.parse({
    crumbproofBook: 1,
    site: { name: 'Test bakery', regime: 'EU' },
    ingredients,
    recipes,
  });
}

const EU = { measures: 'metric' as const, regime: 'EU' as const };
const US = { measures: 'us-customary' as const, regime: 'US' as const };

/*
 * Worked recipe (figures per 100 g typed for the test; arithmetic by hand).
 *
 * Sponge: flour 100 g, sugar 100 g, egg 100 g, butter 100 g = 400 g raw, baked to 360 g.
 *   flour   fat 1   sat 0.2 carb 70  sugars 2   fibre 3 protein 10 salt 0   trans 0 chol 0
 *   sugar   fat 0   sat 0   carb 100 sugars 100 fibre 0 protein 0  salt 0   trans 0 chol 0 (addsSugars)
 *   egg     fat 10  sat 3   carb 0   sugars 0   fibre 0 protein 12 sodium 0.14 only    trans 0 chol 370
 *   butter  fat 80  sat 50  carb 1   sugars 1   fibre 0 protein 1  salt 0.1 trans 3 chol 200
 *   sponge totals: fat 91, sat 53.2, trans 3, chol 570 mg, carb 171, sugars 103, added 100,
 *   fibre 3, protein 23, salt 0 + 0.14×2.5 + 0.1 = 0.45 (Annex I pt 11), sodium 0.14 + 0.1/2.5 = 0.18.
 *
 * Cake: sponge 180 g (half of the 360 g finished sponge → half its totals), cream 100 g,
 *   hazelnuts 5 g as a contact line (no nutrients, no weight). No finishedWeightG → 280 g.
 *   cream   fat 40  sat 25  carb 3   sugars 3   fibre 0 protein 2  salt 0.1 trans 1 chol 120
 *   cake totals: fat 45.5 + 40 = 85.5; sat 26.6 + 25 = 51.6; trans 1.5 + 1 = 2.5; chol 285 + 120 = 405;
 *   carb 85.5 + 3 = 88.5; sugars 51.5 + 3 = 54.5; added 50; fibre 1.5; protein 11.5 + 2 = 13.5;
 *   salt 0.225 + 0.1 = 0.325; sodium 0.09 + 0.04 = 0.13.
 *   per 100 g (× 100/280): fat 30.536, sat 18.429, trans 0.893, chol 144.64 mg, carb 31.607,
 *   sugars 19.464, added 17.857, fibre 0.5357, protein 4.821, salt 0.11607, sodium 0.046429.
 *   energy (Annex XIV) of the totals: 37×85.5 + 17×88.5 + 8×1.5 + 17×13.5 = 4909.5 kJ → 1753.39 kJ/100 g;
 *   9×85.5 + 4×88.5 + 2×1.5 + 4×13.5 = 1180.5 kcal → 421.61 kcal/100 g.
 *   EU label per 100 g (Commission guidance 2012, from memory): 1753 kJ, 422 kcal, fat 31 g,
 *   saturates 18 g, carbohydrate 32 g, sugars 19 g, fibre 0.5 g, protein 4.8 g, salt 0.12 g.
 *   Portion 60 g (= 3/14 of the cake): fat 18.321, sat 11.057, carb 18.964, sugars 11.679, fibre 0.3214,
 *   protein 2.893, salt 0.06964; energy 4909.5 × 3/14 = 1052.04 kJ, 1180.5 × 3/14 = 252.96 kcal;
 *   label 1052 kJ, 253 kcal, 18 g, 11 g, 19 g, 12 g,
 *   <0.5 g, 2.9 g, 0.07 g.
 */
const cakeBook = (): Book =>
  book(
    [
      ing(
        'flour',
        {
          fat: 1,
          saturates: 0.2,
          transFat: 0,
          cholesterolMg: 0,
          carbohydrate: 70,
          sugars: 2,
          fibre: 3,
          protein: 10,
          salt: 0,
        },
        { addsSugars: false },
      ),
      ing(
        'sugar',
        { fat: 0, saturates: 0, transFat: 0, cholesterolMg: 0, carbohydrate: 100, sugars: 100, fibre: 0, protein: 0, salt: 0 },
        { addsSugars: true },
      ),
      ing('egg', {
        fat: 10,
        saturates: 3,
        transFat: 0,
        cholesterolMg: 370,
        carbohydrate: 0,
        sugars: 0,
        fibre: 0,
        protein: 12,
        sodium: 0.14,
        source: 'test figures',
      }),
      ing(
        'butter',
        {
          fat: 80,
          saturates: 50,
          transFat: 3,
          cholesterolMg: 200,
          carbohydrate: 1,
          sugars: 1,
          fibre: 0,
          protein: 1,
          salt: 0.1,
          energyKj: 3600, // a stated energy is ignored: energy is recomputed from the nutrients
        },
        { addsSugars: false },
      ),
      ing(
        'cream',
        {
          fat: 40,
          saturates: 25,
          transFat: 1,
          cholesterolMg: 120,
          carbohydrate: 3,
          sugars: 3,
          fibre: 0,
          protein: 2,
          salt: 0.1,
        },
        { addsSugars: false },
      ),
      ing('hazelnuts'), // no nutrition: would make everything incomplete if the contact line counted
    ],
    [
      {
        id: 'sponge',
        name: 'Sponge',
        finishedWeightG: 360,
        lines: [
          { use: 'flour', qty: 100, unit: 'g' },
          { use: 'sugar', qty: 100, unit: 'g' },
          { use: 'egg', qty: 100, unit: 'g' },
          { use: 'butter', qty: 0.1, unit: 'kg' },
        ],
      },
      {
        id: 'cake',
        name: 'Cream cake',
        sale: { portionG: 60 },
        lines: [
          { use: 'sponge', qty: 180, unit: 'g' },
          { use: 'cream', qty: 100, unit: 'g' },
          { use: 'hazelnuts', qty: 5, unit: 'g', role: 'contact' },
        ],
      },
    ],
  );

describe('computeNutrition: worked recipe with baking loss, a sub-recipe and a contact line', () => {
  const d = computeNutrition(cakeBook(), 'cake', EU);

  it('divides by the sum of ingredient lines (contact line excluded)', () => {
    expect(d.finishedWeightG).toBe(280);
    expect(d.weightFrom).toBe('sumOfLines');
    expect(d.portionG).toBe(60);
    expect(d.incomplete).toEqual([]);
    expect(d.missing).toEqual([]);
  });

  it.each([
    { key: 'fat' as const, v: 30.5357 },
    { key: 'saturates' as const, v: 18.4286 },
    { key: 'transFat' as const, v: 0.89286 },
    { key: 'cholesterolMg' as const, v: 144.643 },
    { key: 'carbohydrate' as const, v: 31.6071 },
    { key: 'sugars' as const, v: 19.4643 },
    { key: 'addedSugars' as const, v: 17.8571 },
    { key: 'fibre' as const, v: 0.535714 },
    { key: 'protein' as const, v: 4.82143 },
    { key: 'salt' as const, v: 0.116071 },
    { key: 'sodium' as const, v: 0.0464286 },
    { key: 'energyKj' as const, v: 1753.39 },
    { key: 'energyKcal' as const, v: 421.607 },
  ])('per 100 g $key ≈ $v (hand computation above)', ({ key, v }) => {
    expect(d.per100g[key]).toBeCloseTo(v, 2);
  });

  it('scales to the portion', () => {
    expect(d.perPortion?.fat).toBeCloseTo((85.5 * 3) / 14, 9);
    expect(d.perPortion?.energyKj).toBeCloseTo((4909.5 * 3) / 14, 9);
  });

  it('prints the EU label per 100 g and per portion (Commission guidance 2012, from memory)', () => {
    const rows = d.label.eu?.rows ?? [];
    expect(rows.map((r) => [r.key, r.per100g.text, r.perPortion?.text])).toEqual([
      ['energyKj', '1753 kJ', '1052 kJ'],
      ['energyKcal', '422 kcal', '253 kcal'],
      ['fat', '31 g', '18 g'],
      ['saturates', '18 g', '11 g'],
      ['carbohydrate', '32 g', '19 g'],
      ['sugars', '19 g', '12 g'],
      ['fibre', '0.5 g', '<0.5 g'],
      ['protein', '4.8 g', '2.9 g'],
      ['salt', '0.12 g', '0.07 g'],
    ]);
    expect(rows[2].per100g.value).toBeCloseTo(30.5357, 3); // unrounded beside the printed text
    expect(d.label.printed).toBe('eu');
  });

  it('lists the source of each leaf ingredient, not of contact lines', () => {
    expect(d.sources.map((s) => s.id)).toEqual(['flour', 'sugar', 'egg', 'butter', 'cream']);
    expect(d.sources.find((s) => s.id === 'egg')?.source).toBe('test figures');
    expect(d.sources.find((s) => s.id === 'flour')?.source).toBeNull();
  });

  it('uses the sub-recipe on its own with its finished weight', () => {
    const s = computeNutrition(cakeBook(), 'sponge', EU);
    expect(s.finishedWeightG).toBe(360);
    expect(s.weightFrom).toBe('finishedWeightG');
    expect(s.per100g.fat).toBeCloseTo((91 / 360) * 100, 9);
    expect(s.perPortion).toBeNull();
  });
});

/*
 * Same cake per 60 g serving for the US (21 CFR 101.9(c), FDA Labeling Guide App. H; DVs from memory):
 *   calories 4-4-9: 9×85.5 + 4×(88.5 + 1.5) + 4×13.5 = 1183.5 × 3/14 = 253.61 → 250;
 *   total fat 18.32 → 18 g, 23.49 % → 23 %; saturated 11.06 → 11 g, 55.29 % → 55 %; trans 0.536 → 0.5 g;
 *   cholesterol 86.79 → 85 mg, 28.93 % → 29 %; sodium 27.86 mg → 30 mg, 1.21 % → 1 %;
 *   total carbohydrate (carbohydrate + fibre) 19.29 → 19 g, 7.01 % → 7 %; fibre 0.321 → 0 g, 0 %;
 *   sugars 11.68 → 12 g; added sugars 10.71 → 11 g, 21.43 % → 21 %; protein 2.89 → 3 g, 5.79 % → 6 %.
 */
describe('computeNutrition: US Nutrition Facts per serving', () => {
  const d = computeNutrition(cakeBook(), 'cake', US);
  const rows = d.label.us?.rows ?? [];

  it('prints amounts and %DV', () => {
    expect(d.label.printed).toBe('us');
    expect(d.label.us?.servingG).toBe(60);
    expect(rows.map((r) => [r.key, r.amount.text, r.percentDv?.text ?? null])).toEqual([
      ['calories', '250', null],
      ['totalFat', '18 g', '23%'],
      ['saturatedFat', '11 g', '55%'],
      ['transFat', '0.5 g', null],
      ['cholesterol', '85 mg', '29%'],
      ['sodium', '30 mg', '1%'],
      ['totalCarbohydrate', '19 g', '7%'],
      ['dietaryFiber', '0 g', '0%'],
      ['totalSugars', '12 g', null],
      ['addedSugars', '11 g', '21%'],
      ['protein', '3 g', '6%'],
    ]);
  });

  it('keeps the unrounded amounts', () => {
    const cal = rows.find((r) => r.key === 'calories');
    expect(cal?.amount.value).toBeCloseTo((1183.5 * 3) / 14, 9);
    const fat = rows.find((r) => r.key === 'totalFat');
    expect(fat?.percentDv?.value).toBeCloseTo(((85.5 * 3) / 14 / 78) * 100, 9);
  });
});

describe('computeNutrition: missing figures are incomplete, never zero', () => {
  const b = book(
    [
      ing('flour', { fat: 1, saturates: 0.2, carbohydrate: 70, sugars: 2, fibre: 3, protein: 10, salt: 0 }),
      ing('mystery-crunch', { fat: 20, saturates: 5, carbohydrate: 60, sugars: 30, protein: 5, salt: 0.5 }), // no fibre
      ing('sprinkles'), // no nutrition at all
    ],
    [
      {
        id: 'bake',
        name: 'Bake',
        sale: { portionG: 50 },
        lines: [
          { use: 'flour', qty: 100, unit: 'g' },
          { use: 'mystery-crunch', qty: 50, unit: 'g' },
          { use: 'sprinkles', qty: 5, unit: 'g' },
        ],
      },
    ],
  );
  const d = computeNutrition(b, 'bake', EU);

  it('lists incomplete figures and which ingredients lack them', () => {
    expect(d.incomplete).toEqual(expect.arrayContaining(['energyKj', 'energyKcal', 'fat', 'fibre', 'salt']));
    const fibre = d.missing.find((m) => m.nutrient === 'fibre');
    expect(fibre?.ingredients).toEqual([
      { id: 'mystery-crunch', name: 'mystery crunch' },
      { id: 'sprinkles', name: 'sprinkles' },
    ]);
    const fat = d.missing.find((m) => m.nutrient === 'fat');
    expect(fat?.ingredients).toEqual([{ id: 'sprinkles', name: 'sprinkles' }]);
    const energy = d.missing.find((m) => m.nutrient === 'energyKj');
    expect(energy?.ingredients.map((i) => i.id)).toEqual(['mystery-crunch', 'sprinkles']);
    expect(d.per100g.fibre).toBeNull();
    expect(d.per100g.energyKj).toBeNull();
    expect(d.sources.find((s) => s.id === 'sprinkles')).toEqual({
      id: 'sprinkles',
      name: 'sprinkles',
      source: null,
      hasNutrition: false,
    });
  });

  it('shows them as "incomplete" on the label', () => {
    const fibre = d.label.eu?.rows.find((r) => r.key === 'fibre');
    expect(fibre?.per100g.text).toBe('incomplete');
    expect(fibre?.perPortion?.text).toBe('incomplete');
    expect(d.label.eu?.rows.find((r) => r.key === 'energyKj')?.per100g.text).toBe('incomplete');
  });

  it('keeps the other figures when one ingredient lacks fibre (neither gives trans fat or cholesterol, nor says whether its sugars are added)', () => {
    const b2 = book(
      b.ingredients.filter((i) => i.id !== 'sprinkles'),
      [{ ...b.recipes[0], lines: b.recipes[0].lines.filter((l) => l.use !== 'sprinkles') }],
    );
    const d2 = computeNutrition(b2, 'bake', EU);
    expect(d2.incomplete).toEqual(['energyKj', 'energyKcal', 'transFat', 'cholesterolMg', 'addedSugars', 'fibre']);
    // fat: (1 + 10) / 150 g × 100
    expect(d2.per100g.fat).toBeCloseTo((11 / 150) * 100, 9);
    const us = computeNutrition(b2, 'bake', US).label.us?.rows ?? [];
    expect(us.find((r) => r.key === 'calories')?.amount.text).toBe('incomplete');
    expect(us.find((r) => r.key === 'totalCarbohydrate')?.amount.text).toBe('incomplete');
    expect(us.find((r) => r.key === 'dietaryFiber')?.percentDv?.text).toBe('incomplete');
    expect(us.find((r) => r.key === 'totalFat')?.amount.text).not.toBe('incomplete');
  });
});

describe('computeNutrition: energy, salt and added sugars from ingredient figures', () => {
  // Regulation (EU) No 1169/2011 Annex XIV: fat 20, carbohydrate 50, protein 6, fibre 2 g
  // → 20×37 + 50×17 + 6×17 + 2×8 = 1708 kJ; 20×9 + 50×4 + 6×4 + 2×2 = 408 kcal.
  it('recomputes energy from the nutrients of a single ingredient', () => {
    const b = book(
      [ing('mix', { fat: 20, saturates: 1, carbohydrate: 50, sugars: 1, fibre: 2, protein: 6, salt: 0, energyKj: 1 })],
      [{ id: 'r', name: 'R', lines: [{ use: 'mix', qty: 250, unit: 'g' }] }],
    );
    const d = computeNutrition(b, 'r', EU);
    expect(d.per100g.energyKj).toBeCloseTo(1708, 9);
    expect(d.per100g.energyKcal).toBeCloseTo(408, 9);
    expect(d.label.eu?.rows[0].per100g.text).toBe('1708 kJ');
    expect(d.label.eu?.rows[1].per100g.text).toBe('408 kcal');
  });

  // Regulation (EU) No 1169/2011 Annex I point 11 (salt = sodium × 2.5): sodium 0.4 g/100 g → salt 1.0 g.
  it('derives salt from sodium when only sodium is given', () => {
    const b = book(
      [ing('brine-mix', { fat: 0, saturates: 0, carbohydrate: 0, sugars: 0, fibre: 0, protein: 0, sodium: 0.4 })],
      [{ id: 'r', name: 'R', lines: [{ use: 'brine-mix', qty: 100, unit: 'g' }] }],
    );
    const d = computeNutrition(b, 'r', EU);
    expect(d.per100g.salt).toBeCloseTo(1.0, 12);
    expect(d.label.eu?.rows.find((r) => r.key === 'salt')?.per100g.text).toBe('1.0 g');
  });

  it('counts added sugars from the flag, or the stated figure when given', () => {
    const base = { fat: 0, saturates: 0, carbohydrate: 80, sugars: 80, fibre: 0, protein: 0, salt: 0 };
    const b = book(
      [
        ing('syrup', base, { addsSugars: true }),
        ing('fruit-paste', { ...base, addedSugars: 20 }, { addsSugars: true }),
        ing('dates', base, { addsSugars: false }),
      ],
      [
        {
          id: 'r',
          name: 'R',
          lines: [
            { use: 'syrup', qty: 100, unit: 'g' },
            { use: 'fruit-paste', qty: 100, unit: 'g' },
            { use: 'dates', qty: 100, unit: 'g' },
          ],
        },
      ],
    );
    // (80 + 20 + 0) g added sugars in 300 g → 33.33 g/100 g; sugars 240/300 → 80 g/100 g.
    // Dates that say nothing about added sugars would leave the figure incomplete (checked below).
    const d = computeNutrition(b, 'r', EU);
    expect(d.per100g.addedSugars).toBeCloseTo(100 / 3, 9);
    expect(d.per100g.sugars).toBeCloseTo(80, 9);
  });

  it('weighs volume lines with gPerMl (1 US cup = 231 in³ × 16.387064 cm³ / 16 = 236.5882365 mL, NIST, from memory)', () => {
    const milk = { fat: 4, saturates: 2.5, carbohydrate: 5, sugars: 5, fibre: 0, protein: 3.3, salt: 0.1 };
    const b = book([ing('milk', milk, { gPerMl: 1.03 })], [{ id: 'r', name: 'R', lines: [{ use: 'milk', qty: 1, unit: 'cup' }] }]);
    const d = computeNutrition(b, 'r', US);
    expect(d.finishedWeightG).toBeCloseTo(236.5882365 * 1.03, 9);
    expect(d.per100g.fat).toBeCloseTo(4, 9);
  });
});

describe('computeNutrition: lines that cannot be weighed', () => {
  const b = book(
    [
      ing('milk', { fat: 4, saturates: 2.5, carbohydrate: 5, sugars: 5, fibre: 0, protein: 3.3, salt: 0.1 }),
      ing('flour', { fat: 1, saturates: 0.2, carbohydrate: 70, sugars: 2, fibre: 3, protein: 10, salt: 0 }),
    ],
    [
      {
        id: 'batter',
        name: 'Batter',
        lines: [
          { use: 'milk', qty: 200, unit: 'ml' },
          { use: 'flour', qty: 100, unit: 'g' },
        ],
      },
      {
        id: 'baked',
        name: 'Baked',
        finishedWeightG: 250,
        lines: [
          { use: 'milk', qty: 200, unit: 'ml' },
          { use: 'flour', qty: 100, unit: 'g' },
        ],
      },
    ],
  );

  it('without a finished weight, makes every figure incomplete and says what is needed', () => {
    const d = computeNutrition(b, 'batter', EU);
    expect(d.finishedWeightG).toBeNull();
    expect(d.unweighed).toEqual([{ recipeId: 'batter', use: 'milk', needs: 'gPerMl' }]);
    expect(d.per100g.fat).toBeNull();
    expect(d.missing.find((m) => m.nutrient === 'fat')?.ingredients).toEqual([
      { id: 'milk', name: 'milk' },
      { id: 'flour', name: 'flour' },
    ]);
  });

  it('passes an unweighed line of a sub-recipe up once, however often the sub-recipe is used', () => {
    const b2 = book(b.ingredients, [
      ...b.recipes,
      {
        id: 'tray',
        name: 'Tray',
        lines: [
          { use: 'batter', qty: 100, unit: 'g' },
          { use: 'batter', qty: 50, unit: 'g' },
          { use: 'flour', qty: 10, unit: 'g' },
        ],
      },
    ]);
    const d = computeNutrition(b2, 'tray', EU);
    expect(d.unweighed).toEqual([{ recipeId: 'batter', use: 'milk', needs: 'gPerMl' }]);
    expect(d.finishedWeightG).toBe(160);
    expect(d.per100g.protein).toBeNull();
  });

  it('with a finished weight, still cannot count the unweighed line', () => {
    const d = computeNutrition(b, 'baked', EU);
    expect(d.finishedWeightG).toBe(250);
    expect(d.per100g.fat).toBeNull();
    expect(d.missing.find((m) => m.nutrient === 'fat')?.ingredients.map((i) => i.id)).toEqual(['milk']);
  });
});

describe('computeNutrition: defensive checks', () => {
  const n = { fat: 1, saturates: 0, carbohydrate: 1, sugars: 0, fibre: 0, protein: 1, salt: 0 };

  it('throws on a recipe cycle', () => {
    const b = book(
      [ing('flour', n)],
      [
        { id: 'a', name: 'A', lines: [{ use: 'b', qty: 10, unit: 'g' }] },
        {
          id: 'b',
          name: 'B',
          lines: [
            { use: 'a', qty: 10, unit: 'g' },
            { use: 'flour', qty: 1, unit: 'g' },
          ],
        },
      ],
    );
    expect(() => computeNutrition(b, 'a', EU)).toThrow('Recipe cycle: a → b → a.');
  });

  it('throws on an unknown id', () => {
    const b = book([ing('flour', n)], [{ id: 'a', name: 'A', lines: [{ use: 'sugar', qty: 10, unit: 'g' }] }]);
    expect(() => computeNutrition(b, 'a', EU)).toThrow(/neither an ingredient nor a recipe/);
    expect(() => computeNutrition(b, 'zzz', EU)).toThrow('Unknown recipe "zzz".');
  });

  it('throws when a recipe has only contact lines and no finished weight', () => {
    const b = book([ing('flour', n)], [{ id: 'a', name: 'A', lines: [{ use: 'flour', qty: 10, unit: 'g', role: 'contact' }] }]);
    expect(() => computeNutrition(b, 'a', EU)).toThrow(/no ingredient line/);
  });

  it('throws on contradictory polyol figures, naming the ingredient', () => {
    const b = book(
      [ing('sweetener', { ...n, carbohydrate: 10, polyols: 20 })],
      [{ id: 'a', name: 'A', lines: [{ use: 'sweetener', qty: 10, unit: 'g' }] }],
    );
    expect(() => computeNutrition(b, 'a', EU)).toThrow(/sweetener/);
  });

  it('prints no format where the regime has none yet, showing the EU one for reference and keeping the figures', () => {
    const b = book([ing('flour', n)], [{ id: 'a', name: 'A', lines: [{ use: 'flour', qty: 10, unit: 'g' }] }]);
    const d = computeNutrition(b, 'a', { measures: 'metric', regime: 'ANZ' });
    expect(d.label.printed).toBeNull();
    expect(d.label.eu?.rows.length).toBeGreaterThan(0);
    expect(d.label.us).toBeNull(); // no portion size
    expect(d.label.note).toMatch(/ANZ/);
    expect(d.per100g.fat).toBeCloseTo(1, 9);
    const us = computeNutrition(b, 'a', US);
    expect(us.label.us).toBeNull(); // no portion size
    expect(us.label.printed).toBeNull();
    expect(us.label.note).toMatch(/portion/);
  });
});
