import type { Book, Regime } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { atThresholdPrecision, compare } from './compare';
import { declare } from './declare';
import { declareProduct } from './product';
import { book, ing, recipe } from './testing/book-builder';
import { buildTree, leavesOf } from './tree';

/*
 * Every legal threshold the engine applies, exactly at it, just above and just below, under each
 * regime of reference-data/regimes.json. Each product is built through a sub-recipe and a bake
 * loss, so that binary arithmetic lands a hair off the figure worked out by hand; every case
 * "at" the threshold asserts that hair, so it fails if the threshold is compared on the raw
 * floating-point figure instead of at the threshold precision (compare.ts).
 */
const refs = loadReferenceData();

/** mg/kg of the product as eaten, unrounded, from the leaves' stated figures (the engine's own arithmetic). */
function rawPerKg(b: Book, productId: string, figure: 'sulphiteMgPerKg' | 'glutenMgPerKg'): number {
  const tree = buildTree(b, productId);
  let mg = 0;
  for (const leaf of leavesOf(tree.children)) {
    const stated = leaf.ingredient?.[figure];
    if (stated !== undefined && leaf.role !== 'contact') mg += (leaf.massG / 1000) * stated;
  }
  return mg / (tree.finishedG / 1000);
}

describe('the threshold precision (compare.ts: six significant figures)', () => {
  it.each([
    { value: 9.999999999999998, at: 10 },
    { value: 10.000000000000002, at: 10 },
    { value: 0.012500000000000002, at: 0.0125 },
    { value: 193.54838709677418, at: 193.548 },
    { value: 0, at: 0 },
  ])('$value is compared as $at', ({ value, at }) => {
    expect(atThresholdPrecision(value)).toBe(at);
  });

  it.each([
    { value: 10.000000000000002, comparison: 'gt' as const, result: false },
    { value: 9.999999999999998, comparison: 'gte' as const, result: true },
    { value: 19.999999999999996, comparison: 'lt' as const, result: false },
    { value: 20.000000000000004, comparison: 'lte' as const, result: true },
    // A difference in the sixth significant figure is seen; one below it is not.
    { value: 10.0001, comparison: 'gt' as const, result: true },
    { value: 10.000001, comparison: 'gt' as const, result: false },
  ])('$value $comparison 10 or 20 → $result', ({ value, comparison, result }) => {
    expect(compare(value, comparison, comparison === 'lt' || comparison === 'lte' ? 20 : 10)).toBe(result);
  });
});

describe('sulphites at 10 mg/kg as eaten', () => {
  /*
   * Apricot compote: dried apricots 120 g, sugar 60 g, water 120 g (300 g), cooked down to 240 g.
   * Pastry (unbaked sub-recipe): flour 240 g, butter 120 g, water 40 g (400 g).
   * Apricot slice: compote `compoteG` + pastry 400 g, baked to `finishedG`.
   * Apricots in the slice = 120 × compoteG / 240; SO2 = apricots × figure / finished weight.
   * - compote 100 g, baked 480 g, apricots at 96 mg/kg: 50 g × 96 = 4.8 mg in 0.48 kg = 10 mg/kg,
   *   computed 10.000000000000002;
   * - compote 150 g, baked 540 g, at 72 mg/kg: 75 g × 72 = 5.4 mg in 0.54 kg = 10 mg/kg,
   *   computed 9.999999999999998;
   * - compote 100 g, baked 480 g, at 97 mg/kg: 4.85 mg / 0.48 kg = 10.10 mg/kg (above);
   * - compote 100 g, baked 480 g, at 95 mg/kg: 4.75 mg / 0.48 kg = 9.90 mg/kg (below).
   */
  const slice = (compoteG: number, finishedG: number, apricotMgPerKg: number, regime: Regime) =>
    book(
      [
        ing('apricots', { name: 'Dried apricots', contains: ['sulphites'], sulphiteMgPerKg: apricotMgPerKg }),
        ing('sugar', { name: 'Sugar' }),
        ing('water', { name: 'Water' }),
        ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
        ing('butter', { name: 'Butter', contains: ['milk'] }),
      ],
      [
        recipe(
          'compote',
          [
            ['apricots', 120],
            ['sugar', 60],
            ['water', 120],
          ],
          { name: 'Apricot compote', finishedWeightG: 240 },
        ),
        recipe(
          'pastry',
          [
            ['flour', 240],
            ['butter', 120],
            ['water', 40],
          ],
          { name: 'Pastry' },
        ),
        recipe(
          'slice',
          [
            ['compote', compoteG],
            ['pastry', 400],
          ],
          { name: 'Apricot slice', finishedWeightG: finishedG, sale: { portionG: 60 } },
        ),
      ],
      {},
      regime,
    );

  const cases = {
    'at 10, computed a hair above': { compoteG: 100, finishedG: 480, figure: 96, raw: 'above' },
    'at 10, computed a hair below': { compoteG: 150, finishedG: 540, figure: 72, raw: 'below' },
    'above, 10.1': { compoteG: 100, finishedG: 480, figure: 97, raw: null },
    'below, 9.9': { compoteG: 100, finishedG: 480, figure: 95, raw: null },
  } as const;
  type Case = keyof typeof cases;

  it.each<{ regime: Regime; at: Case; declared: boolean; source: string }>([
    ...(['EU', 'UK'] as const).flatMap((regime) => {
      // Regulation (EU) No 1169/2011 Annex II point 12 (UK: the assimilated Regulation, same text):
      // "concentrations of more than 10 mg/kg or 10 mg/litre in terms of the total SO2".
      const source = 'Regulation (EU) No 1169/2011 Annex II point 12: more than 10 mg/kg';
      return [
        { regime, at: 'at 10, computed a hair above' as const, declared: false, source },
        { regime, at: 'at 10, computed a hair below' as const, declared: false, source },
        { regime, at: 'above, 10.1' as const, declared: true, source },
        { regime, at: 'below, 9.9' as const, declared: false, source },
      ];
    }),
    ...(
      [
        // Canada, Food and Drug Regulations B.01.010.1: added sulphites in a total amount of 10 p.p.m. or more.
        { regime: 'CA' as const, source: 'Food and Drug Regulations B.01.010.1: 10 p.p.m. or more' },
        // Food Standards Code Standard 1.2.3 and Schedule 9 (PEAL): added sulphites in concentrations of 10 mg/kg or more.
        { regime: 'ANZ' as const, source: 'Food Standards Code Standard 1.2.3: 10 mg/kg or more' },
        // 21 CFR 101.100(a)(4): sulfites at 10 ppm or more (from memory).
        { regime: 'US' as const, source: '21 CFR 101.100(a)(4): 10 ppm or more (from memory)' },
      ] as const
    ).flatMap(({ regime, source }) => [
      { regime, at: 'at 10, computed a hair above' as const, declared: true, source },
      { regime, at: 'at 10, computed a hair below' as const, declared: true, source },
      { regime, at: 'above, 10.1' as const, declared: true, source },
      { regime, at: 'below, 9.9' as const, declared: false, source },
    ]),
  ])('$regime, $at: declared $declared ($source)', ({ regime, at, declared }) => {
    const c = cases[at];
    const b = slice(c.compoteG, c.finishedG, c.figure, regime);
    const raw = rawPerKg(b, 'slice', 'sulphiteMgPerKg');
    if (c.raw === 'above') expect(raw).toBeGreaterThan(10);
    if (c.raw === 'below') expect(raw).toBeLessThan(10);
    if (c.raw !== null) expect(raw).toBeCloseTo(10, 12);

    const d = declare(b, 'slice', refs);
    expect(d.sulphites.mgPerKg).toBe(atThresholdPrecision(raw));
    if (c.raw !== null) expect(d.sulphites.mgPerKg).toBe(10);
    expect(d.sulphites.declared).toBe(declared);
    expect(d.sulphites.status).toBe(declared ? 'declared' : 'below-threshold');
    const group = refs.regimes[regime].sulphites.group;
    if (group) expect(d.contains.some((c) => c.allergen === group)).toBe(declared);
    // US: no allergen group; declared sulphites are named in the list (21 CFR 101.100(a)(4), from memory).
    else expect(d.ingredientsText.includes('(sulfites)')).toBe(declared);
  });
});

describe('gluten-free at 20 mg/kg', () => {
  /*
   * Crumble (baked on its own): rice flour 200 g, wheat starch 150 g, butter 150 g, sugar 100 g
   * (600 g), baked to 450 g. Base (unbaked sub-recipe): rice flour 300 g, butter 150 g, water
   * 50 g (500 g). Crumble bar: base 500 g + crumble `crumbleG`, baked to 500 g.
   * Wheat starch in the bar = 150 × crumbleG / 450; gluten = starch × figure / 0.5 kg.
   * - crumble 250 g, starch at 120 mg/kg: 83.33 g × 120 = 10 mg in 0.5 kg = 20 mg/kg,
   *   computed 20.000000000000004;
   * - crumble 200 g, starch at 150 mg/kg: 66.67 g × 150 = 10 mg in 0.5 kg = 20 mg/kg,
   *   computed 19.999999999999996;
   * - crumble 250 g at 126 mg/kg: 10.5 mg / 0.5 kg = 21 mg/kg (above);
   * - crumble 250 g at 114 mg/kg: 9.5 mg / 0.5 kg = 19 mg/kg (below).
   */
  const bar = (crumbleG: number, starchMgPerKg: number, regime: Regime) =>
    book(
      [
        ing('rice', { name: 'Rice flour' }),
        ing('starch', { name: 'Wheat starch', contains: ['wheat'], glutenMgPerKg: starchMgPerKg }),
        ing('butter', { name: 'Butter', contains: ['milk'] }),
        ing('sugar', { name: 'Sugar' }),
        ing('water', { name: 'Water' }),
      ],
      [
        recipe(
          'crumble',
          [
            ['rice', 200],
            ['starch', 150],
            ['butter', 150],
            ['sugar', 100],
          ],
          { name: 'Crumble', finishedWeightG: 450 },
        ),
        recipe(
          'base',
          [
            ['rice', 300],
            ['butter', 150],
            ['water', 50],
          ],
          { name: 'Base' },
        ),
        recipe(
          'bar',
          [
            ['base', 500],
            ['crumble', crumbleG],
          ],
          { name: 'Crumble bar', finishedWeightG: 500, sale: { portionG: 50, claims: ['gluten-free'] } },
        ),
      ],
      {},
      regime,
    );

  const cases = {
    'at 20, computed a hair above': { crumbleG: 250, figure: 120, raw: 'above', mgPerKg: 20 },
    'at 20, computed a hair below': { crumbleG: 200, figure: 150, raw: 'below', mgPerKg: 20 },
    'above, 21': { crumbleG: 250, figure: 126, raw: null, mgPerKg: 21 },
    'below, 19': { crumbleG: 250, figure: 114, raw: null, mgPerKg: 19 },
    'at 0': { crumbleG: 250, figure: 0, raw: null, mgPerKg: 0 },
    'above 0, 19': { crumbleG: 250, figure: 114, raw: null, mgPerKg: 19 },
  } as const;
  type Case = keyof typeof cases;

  type Row = { regime: Regime; at: Case; status: 'ok' | 'fails'; source: string };
  const rows = (regime: Regime, atOk: boolean, source: string): Row[] => [
    { regime, at: 'at 20, computed a hair above', status: atOk ? 'ok' : 'fails', source },
    { regime, at: 'at 20, computed a hair below', status: atOk ? 'ok' : 'fails', source },
    { regime, at: 'above, 21', status: 'fails', source },
    { regime, at: 'below, 19', status: 'ok', source },
  ];

  it.each<Row>([
    // Commission Implementing Regulation (EU) No 828/2014 Article 3 and its Annex: "gluten-free" only
    // where the food as sold contains no more than 20 mg/kg (UK: the assimilated Regulation, from memory).
    ...rows('EU', true, 'Regulation (EU) No 828/2014: no more than 20 mg/kg'),
    ...rows('UK', true, 'assimilated Regulation 828/2014: no more than 20 mg/kg (from memory)'),
    // Canada: Food and Drug Regulations B.24.018 with Health Canada's 2012 position, at most 20 ppm.
    ...rows('CA', true, 'Food and Drug Regulations B.24.018, Health Canada 2012: at most 20 ppm'),
    // 21 CFR 101.91: gluten below 20 ppm, so exactly 20 is not gluten-free.
    ...rows('US', false, '21 CFR 101.91: less than 20 ppm'),
    // Food Standards Code Standard 1.2.7 and Schedule 4: "gluten free" means no detectable gluten
    // (from memory). No figure can be below 0, so the threshold has one side.
    { regime: 'ANZ', at: 'at 0', status: 'ok', source: 'Standard 1.2.7: no detectable gluten (from memory)' },
    { regime: 'ANZ', at: 'above 0, 19', status: 'fails', source: 'Standard 1.2.7: no detectable gluten (from memory)' },
  ])('$regime, $at: gluten-free $status ($source)', ({ regime, at, status }) => {
    const c = cases[at];
    const b = bar(c.crumbleG, c.figure, regime);
    const raw = rawPerKg(b, 'bar', 'glutenMgPerKg');
    if (c.raw === 'above') expect(raw).toBeGreaterThan(20);
    if (c.raw === 'below') expect(raw).toBeLessThan(20);
    expect(raw).toBeCloseTo(c.mgPerKg, 12);

    const d = declare(b, 'bar', refs);
    expect(d.claims['gluten-free'].status).toBe(status);
    expect(d.errors.some((e) => e.code === 'claim-not-met')).toBe(status !== 'ok');
  });

  it('says the figure it compared when the claim fails', () => {
    const d = declare(bar(250, 120, 'US'), 'bar', refs);
    expect(d.claims['gluten-free'].reasons).toEqual([
      { leaf: null, path: [], message: 'Gluten in the product is about 20 mg/kg; gluten-free needs below 20 mg/kg.' },
    ]);
  });
});

describe('added water at 5 % of the finished product (EU, UK)', () => {
  /*
   * Shortcrust (unbaked sub-recipe): flour 150 g, butter 100 g, sugar 20 g, water 30 g (300 g).
   * Jam tart: shortcrust 300 g + apricot jam 80 g (380 g), baked to `finishedG`. The shortcrust
   * has no finished weight of its own, so it loses the tart's bake loss (finished / 380).
   * Water in the shortcrust as baked = 300 × finished / 380 − 270 g of other ingredients
   * (Regulation (EU) No 1169/2011 Annex VII Part A point 1):
   * - baked 360 g: 284.21 − 270 = 14.21 g = 5 % of 284.21 g, computed 5.000000000000002 %;
   * - baked 370 g: 292.11 − 270 = 22.11 g = 7.57 % (above);
   * - baked 350 g: 276.32 − 270 = 6.32 g = 2.29 % (below).
   */
  const tart = (finishedG: number, regime: Regime) =>
    declare(
      book(
        [
          ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
          ing('butter', { name: 'Butter', contains: ['milk'] }),
          ing('sugar', { name: 'Sugar' }),
          ing('water', { name: 'Water' }),
          ing('jam', { name: 'Apricot jam' }),
        ],
        [
          recipe(
            'shortcrust',
            [
              ['flour', 150],
              ['butter', 100],
              ['sugar', 20],
              ['water', 30],
            ],
            { name: 'Shortcrust' },
          ),
          recipe(
            'tart',
            [
              ['shortcrust', 300],
              ['jam', 80],
            ],
            { name: 'Jam tart', finishedWeightG: finishedG },
          ),
        ],
        {},
        regime,
      ),
      'tart',
      refs,
    );
  const pastryNames = (regime: Regime, finishedG: number) => tart(finishedG, regime).ingredients[0].children.map((e) => e.name);

  it('the share at 360 g really is a hair over 5 % in binary arithmetic', () => {
    const asBaked = 300 * (360 / 380);
    const share = (100 * (asBaked - 270)) / asBaked;
    expect(share).toBeGreaterThan(5);
    expect(share).toBeCloseTo(5, 12);
  });

  it.each([
    // Annex VII Part A point 1: need not be listed when it "does not exceed 5 %" (UK: the assimilated Regulation).
    { regime: 'EU' as const, finishedG: 360, listed: false },
    { regime: 'EU' as const, finishedG: 370, listed: true },
    { regime: 'EU' as const, finishedG: 350, listed: false },
    { regime: 'UK' as const, finishedG: 360, listed: false },
    { regime: 'UK' as const, finishedG: 370, listed: true },
    { regime: 'UK' as const, finishedG: 350, listed: false },
  ])('$regime, tart baked to $finishedG g: water listed $listed', ({ regime, finishedG, listed }) => {
    const d = tart(finishedG, regime);
    expect(pastryNames(regime, finishedG).includes('Water')).toBe(listed);
    expect(d.warnings.some((w) => w.code === 'added-water-omitted' && w.ingredient === 'water')).toBe(!listed);
  });

  it.each([
    // No added-water derogation: US FDA Food Labeling Guide ch. IV Q5 (added water is an ingredient,
    // in descending order); Canada Food and Drug Regulations B.01.008 (from memory); ANZ Standard 1.2.4
    // (ingoing weight, from memory).
    ...(['US', 'CA', 'ANZ'] as const).flatMap((regime) => [360, 370, 350].map((finishedG) => ({ regime, finishedG }))),
  ])('$regime, tart baked to $finishedG g: water listed by the 30 g used', ({ regime, finishedG }) => {
    const water = tart(finishedG, regime).ingredients[0].children.find((e) => e.name === 'Water');
    expect(water).toMatchObject({ orderWeightG: 30 });
  });
});

describe('QUID at 100 % (Regulation (EU) No 1169/2011 Annex VIII point 4(a))', () => {
  /*
   * Apple compote: apples 400 g, sugar 250 g (650 g), cooked down to 600 g. Apples per gram of
   * compote = 400 / 600.
   * Apple leather: compote 330 g, dried to `leatherG`: apples 220 g.
   * - dried to 220 g: 100 × 220 / 220 = 100 %, computed 100.00000000000001: "does not exceed"
   *   100 %, so the percentage is given;
   * - 210 g: 104.76 % → 104.8 g per 100 g; 230 g: 95.65 % → 96 %.
   * Apple and oat bar: compote 330 g + oats 100 g, baked to `barG`, apples and oats QUIDed:
   * - 320 g: apples 68.75 % + oats 31.25 % = 100 % exactly, the sum computed 100.00000000000001;
   * - 310 g: 70.97 + 32.26 = 103.2 % (above); 330 g: 66.67 + 30.30 = 96.97 % (below).
   */
  const compote = recipe(
    'compote',
    [
      ['apples', 400],
      ['sugar', 250],
    ],
    { name: 'Apple compote', finishedWeightG: 600 },
  );
  const ingredients = [
    ing('apples', { name: 'Apples' }),
    ing('sugar', { name: 'Sugar' }),
    ing('oats', { name: 'Oats', contains: ['oats'] }),
  ];
  const leather = (leatherG: number, regime: Regime) =>
    declare(
      book(
        ingredients,
        [
          compote,
          recipe('leather', [['compote', 330]], {
            name: 'Apple leather',
            finishedWeightG: leatherG,
            sale: { portionG: 20, quid: ['apples'] },
          }),
        ],
        {},
        regime,
      ),
      'leather',
      refs,
    );
  const oatBar = (barG: number, regime: Regime) =>
    declare(
      book(
        ingredients,
        [
          compote,
          recipe(
            'bar',
            [
              ['compote', 330],
              ['oats', 100],
            ],
            { name: 'Apple and oat bar', finishedWeightG: barG, sale: { portionG: 40, quid: ['apples', 'oats'] } },
          ),
        ],
        {},
        regime,
      ),
      'bar',
      refs,
    );

  it.each([
    { regime: 'EU' as const, leatherG: 220, text: 'Apples 100%' },
    { regime: 'EU' as const, leatherG: 210, text: 'Prepared with 104.8 g of apples per 100 g' },
    { regime: 'EU' as const, leatherG: 230, text: 'Apples 96%' },
    { regime: 'UK' as const, leatherG: 220, text: 'Apples 100%' },
    { regime: 'UK' as const, leatherG: 210, text: 'Prepared with 104.8 g of apples per 100 g' },
    { regime: 'UK' as const, leatherG: 230, text: 'Apples 96%' },
  ])('$regime, one ingredient: leather dried to $leatherG g → "$text"', ({ regime, leatherG, text }) => {
    const [q] = leather(leatherG, regime).quid;
    if (leatherG === 220) {
      expect(q.percent).toBeGreaterThan(100);
      expect(q.percent).toBeCloseTo(100, 12);
    }
    expect(q.text).toBe(text);
  });

  it.each([
    { regime: 'EU' as const, barG: 320, texts: ['Apples 69%', 'Oats 31%'] },
    { regime: 'EU' as const, barG: 310, texts: ['Prepared with 71 g of apples per 100 g', 'Prepared with 32.3 g of oats per 100 g'] },
    { regime: 'EU' as const, barG: 330, texts: ['Apples 67%', 'Oats 30%'] },
    { regime: 'UK' as const, barG: 320, texts: ['Apples 69%', 'Oats 31%'] },
    { regime: 'UK' as const, barG: 310, texts: ['Prepared with 71 g of apples per 100 g', 'Prepared with 32.3 g of oats per 100 g'] },
    { regime: 'UK' as const, barG: 330, texts: ['Apples 67%', 'Oats 30%'] },
  ])('$regime, the total of those shown: bar baked to $barG g → $texts', ({ regime, barG, texts }) => {
    const { quid } = oatBar(barG, regime);
    if (barG === 320) {
      const total = quid[0].percent + quid[1].percent;
      expect(total).toBeGreaterThan(100);
      expect(total).toBeCloseTo(100, 12);
    }
    expect(quid.map((q) => q.text)).toEqual(texts);
  });
});

describe('nutrition rounding steps at their band edges', () => {
  /*
   * Filling: the ingredient under test 50 g + water 100 g, reduced to 120 g. Product: filling
   * `usedG` + water `waterG`, baked to `finishedG`, portion `portionG`. Per gram of product the
   * ingredient brings usedG × 50 / 120 / finishedG g, so per 100 g of product
   * figure × usedG × 50 / (120 × finishedG), and per portion figure × usedG × 50 × portionG /
   * (100 × 120 × finishedG). Figures per 100 g of the ingredient; every other nutrient 0.
   */
  const ZERO = {
    fat: 0,
    saturates: 0,
    transFat: 0,
    cholesterolMg: 0,
    carbohydrate: 0,
    sugars: 0,
    addedSugars: 0,
    fibre: 0,
    protein: 0,
    salt: 0,
  };
  type Key = 'fat' | 'saturates' | 'salt' | 'carbohydrate' | 'cholesterolMg' | 'sodium' | 'protein';
  const product = (
    key: Key,
    figure: number,
    shape: { usedG: number; waterG: number; finishedG: number; portionG: number },
    regime: Regime,
  ) => {
    const nutrition: Record<string, number> = { ...ZERO, [key]: figure };
    if (key === 'saturates') nutrition.fat = figure;
    if (key === 'sodium') delete nutrition.salt;
    return declareProduct(
      book(
        [ing('x', { name: 'Test ingredient', nutrition }), ing('water', { name: 'Water', nutrition: { ...ZERO } })],
        [
          recipe(
            'filling',
            [
              ['x', 50],
              ['water', 100],
            ],
            { name: 'Filling', finishedWeightG: 120 },
          ),
          recipe(
            'p',
            [
              ['filling', shape.usedG],
              ['water', shape.waterG],
            ],
            { name: 'Product', finishedWeightG: shape.finishedG, sale: { portionG: shape.portionG } },
          ),
        ],
        {},
        regime,
      ),
      'p',
      refs,
    ).nutrition;
  };

  /*
   * EU and UK per 100 g (European Commission guidance on tolerances and rounding, December 2012,
   * rounding table, from memory): "0 g" or "<0.5 g" at or under 0.5 g (fat, carbohydrate, sugars,
   * protein, fibre), "<0.1 g" at or under 0.1 g (saturates), "<0.01 g" at or under 0.0125 g (salt);
   * above, nearest 0.1 g (0.01 g for salt).
   * Fat: used 90 g, water 200 g, baked 240 g: per 100 g = figure × 90 × 50 / (120 × 240) = figure × 0.15625;
   *   3.2 → 0.5 (computed 0.5000000000000001); 3.84 → 0.6; 2.56 → 0.4.
   * Saturates and salt: used 90 g, water 300 g, baked 300 g: per 100 g = figure / 8;
   *   saturates 0.8 → 0.1 (computed 0.10000000000000002); 1.6 → 0.2; 0.4 → 0.05;
   *   salt 0.1 → 0.0125 (computed 0.012500000000000002); 0.16 → 0.02; 0.08 → 0.01.
   * The edges at 10 g (and 1 g of salt) cannot change the printed text by a hair (9.999… rounds
   * to 10.0 and prints "10 g" as 10 does); rounding-eu.spec.ts checks them at exact figures.
   */
  const FAT = { usedG: 90, waterG: 200, finishedG: 240, portionG: 60 };
  const SAT_SALT = { usedG: 90, waterG: 300, finishedG: 300, portionG: 60 };
  it.each([
    ...(['EU', 'UK'] as const).flatMap((regime) => [
      { regime, key: 'fat' as const, figure: 3.2, shape: FAT, at: 0.5, text: '<0.5 g' },
      { regime, key: 'fat' as const, figure: 3.84, shape: FAT, at: null, text: '0.6 g' },
      { regime, key: 'fat' as const, figure: 2.56, shape: FAT, at: null, text: '<0.5 g' },
      { regime, key: 'saturates' as const, figure: 0.8, shape: SAT_SALT, at: 0.1, text: '<0.1 g' },
      { regime, key: 'saturates' as const, figure: 1.6, shape: SAT_SALT, at: null, text: '0.2 g' },
      { regime, key: 'saturates' as const, figure: 0.4, shape: SAT_SALT, at: null, text: '<0.1 g' },
      { regime, key: 'salt' as const, figure: 0.1, shape: SAT_SALT, at: 0.0125, text: '<0.01 g' },
      { regime, key: 'salt' as const, figure: 0.16, shape: SAT_SALT, at: null, text: '0.02 g' },
      { regime, key: 'salt' as const, figure: 0.08, shape: SAT_SALT, at: null, text: '<0.01 g' },
    ]),
  ])('$regime per 100 g: $key at $figure g per 100 g of the ingredient → "$text"', ({ regime, key, figure, shape, at, text }) => {
    const n = product(key, figure, shape, regime);
    const raw = n.per100g[key] as number;
    if (at !== null) {
      expect(raw).toBeGreaterThan(at);
      expect(raw).toBeCloseTo(at, 12);
    }
    expect(n.label.printed).toBe('eu');
    expect(n.label.eu?.rows.find((r) => r.key === key)?.per100g.text).toBe(text);
  });

  /*
   * US per serving (21 CFR 101.9(c)(1)-(7) and FDA "A Food Labeling Guide" Appendix H; paragraph
   * numbers from memory). Used 100 g, water 200 g, baked 280 g: per serving = figure × portion / 672.
   * - calories (c)(1), < 5 → 0: carbohydrate only, serving 75 g: 11.2 → 1.25 g × 4 kcal/g = 5 kcal
   *   (computed 4.999999999999999) → "5"; 13.44 → 6 kcal → "5"; 8.96 → 4 kcal → "0".
   * - total fat (c)(2), < 0.5 → 0, serving 60 g: 5.6 → 0.5 g (computed 0.4999999999999999) → "0.5 g";
   *   6.72 → 0.6 → "0.5 g"; 4.48 → 0.4 → "0 g".
   * - cholesterol (c)(3), < 2 → 0, serving 60 g: 22.4 → 2 mg (computed 1.9999999999999996)
   *   → "less than 5 mg"; 33.6 → 3 → "less than 5 mg"; 11.2 → 1 → "0 mg".
   * - cholesterol (c)(3), 2 to 5 → "less than 5 mg", serving 50 g: 67.2 → 5 mg (computed
   *   5.000000000000001) → "less than 5 mg"; 80.64 → 6 → "5 mg"; 53.76 → 4 → "less than 5 mg".
   * - sodium (c)(4), < 5 mg → 0, serving 40 g (figures in g per 100 g): 0.084 → 5 mg (computed
   *   4.999999999999999) → "5 mg"; 0.1008 → 6 mg → "5 mg"; 0.0672 → 4 mg → "0 mg".
   * - carbohydrate (c)(6) and protein (c)(7), < 0.5 → 0 and < 1 → "less than 1 g", serving 60 g:
   *   5.6 → 0.5 g (computed 0.4999999999999999) → "less than 1 g"; 6.72 → 0.6 → "less than 1 g";
   *   4.48 → 0.4 → "0 g"; 11.2 → 1 g (computed 0.9999999999999998) → "1 g"; 13.44 → 1.2 → "1 g";
   *   8.96 → 0.8 → "less than 1 g".
   * The edges at 50 kcal, 5 g of fat and 140 mg of sodium cannot change the printed text by a hair
   * (both sides round to the same figure there); rounding-us.spec.ts checks them at exact figures.
   */
  const US = (portionG: number) => ({ usedG: 100, waterG: 200, finishedG: 280, portionG });
  it.each([
    { row: 'calories', key: 'carbohydrate' as const, figure: 11.2, portionG: 75, at: 5, text: '5' },
    { row: 'calories', key: 'carbohydrate' as const, figure: 13.44, portionG: 75, at: null, text: '5' },
    { row: 'calories', key: 'carbohydrate' as const, figure: 8.96, portionG: 75, at: null, text: '0' },
    { row: 'totalFat', key: 'fat' as const, figure: 5.6, portionG: 60, at: 0.5, text: '0.5 g' },
    { row: 'totalFat', key: 'fat' as const, figure: 6.72, portionG: 60, at: null, text: '0.5 g' },
    { row: 'totalFat', key: 'fat' as const, figure: 4.48, portionG: 60, at: null, text: '0 g' },
    { row: 'cholesterol', key: 'cholesterolMg' as const, figure: 22.4, portionG: 60, at: 2, text: 'less than 5 mg' },
    { row: 'cholesterol', key: 'cholesterolMg' as const, figure: 33.6, portionG: 60, at: null, text: 'less than 5 mg' },
    { row: 'cholesterol', key: 'cholesterolMg' as const, figure: 11.2, portionG: 60, at: null, text: '0 mg' },
    { row: 'cholesterol', key: 'cholesterolMg' as const, figure: 67.2, portionG: 50, at: 5, text: 'less than 5 mg' },
    { row: 'cholesterol', key: 'cholesterolMg' as const, figure: 80.64, portionG: 50, at: null, text: '5 mg' },
    { row: 'cholesterol', key: 'cholesterolMg' as const, figure: 53.76, portionG: 50, at: null, text: 'less than 5 mg' },
    { row: 'sodium', key: 'sodium' as const, figure: 0.084, portionG: 40, at: 5, text: '5 mg' },
    { row: 'sodium', key: 'sodium' as const, figure: 0.1008, portionG: 40, at: null, text: '5 mg' },
    { row: 'sodium', key: 'sodium' as const, figure: 0.0672, portionG: 40, at: null, text: '0 mg' },
    ...(['carbohydrate', 'protein'] as const).flatMap((key) => {
      const row = key === 'carbohydrate' ? 'totalCarbohydrate' : 'protein';
      return [
        { row, key, figure: 5.6, portionG: 60, at: 0.5, text: 'less than 1 g' },
        { row, key, figure: 6.72, portionG: 60, at: null, text: 'less than 1 g' },
        { row, key, figure: 4.48, portionG: 60, at: null, text: '0 g' },
        { row, key, figure: 11.2, portionG: 60, at: 1, text: '1 g' },
        { row, key, figure: 13.44, portionG: 60, at: null, text: '1 g' },
        { row, key, figure: 8.96, portionG: 60, at: null, text: 'less than 1 g' },
      ];
    }),
  ])('US per serving of $portionG g: $row from $key at $figure → "$text"', ({ row, key, figure, portionG, at, text }) => {
    const n = product(key, figure, US(portionG), 'US');
    expect(n.label.printed).toBe('us');
    const cell = n.label.us?.rows.find((r) => r.key === row)?.amount;
    if (at !== null) {
      // The hair is on the side that would print the other text.
      const raw = cell?.value as number;
      expect(raw).not.toBe(at);
      expect(raw).toBeCloseTo(at, 12);
    }
    expect(cell?.text).toBe(text);
  });

  it('CA and ANZ print no nutrition label of their own, so they have no rounding edge to meet', () => {
    for (const regime of ['CA', 'ANZ'] as const) expect(product('fat', 5.6, US(60), regime).label.printed).toBeNull();
  });
});
