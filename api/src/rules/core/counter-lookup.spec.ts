import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  bookSchema,
  customerVerdict,
  readAloud,
  resolveAsk,
  type BookInput,
  type CounterRules,
  type CustomerAsk,
  type Regime,
} from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declareProduct } from './product';
import { book, ing, recipe } from './testing/book-builder';

/**
 * The counter's lookup (shared/src/counter) on declarations from the real engine: what a
 * customer with an allergy is told about a product. The groups are the regime's reference list
 * (Regulation (EU) No 1169/2011 Annex II; FSANZ Food Standards Code Schedule 9 for ANZ).
 */
const refs = loadReferenceData();
const rulesOf = (regime: Regime): CounterRules => ({
  groups: refs.regimes[regime].groups.map((g) => ({ code: g.code, label: g.label, sources: g.members })),
});
const EU = rulesOf('EU');

type IngredientInput = BookInput['ingredients'][number];
type Handles = BookInput['site']['handles'];

/** A product of plain rice flour and the ingredients given, each 100 g, under the EU list. */
function product(extra: IngredientInput[], handles: Handles = [], regime: Regime = 'EU') {
  const b = book(
    [ing('base', { name: 'Rice flour' }), ...extra],
    [recipe('p', [['base', 500], ...extra.map((e): [string, number] => [e.id, 100])], { name: 'Product', sale: { portionG: 50 } })],
    { handles },
    regime,
  );
  return declareProduct(b, 'p', refs);
}

const ask = (avoid: string[], want: CustomerAsk['want'] = []): CustomerAsk => ({ avoid, want });

describe('a customer avoiding all tree nuts', () => {
  it('is told "may contain" for a supplier statement of one tree nut, with the supplier as the reason', () => {
    const d = product([ing('choc', { name: 'Dark chocolate', mayContain: ['hazelnut'] })]);
    const v = customerVerdict(d, ask(['nuts']), EU);
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain).toEqual([
      expect.objectContaining({
        avoid: 'nuts',
        allergen: 'nuts',
        source: 'hazelnut',
        reason: 'supplier',
        ingredientName: 'Dark chocolate',
      }),
    ]);
    expect(v.contains).toEqual([]);
  });

  it('is told "contains" for any tree nut, naming it and where it is from', () => {
    const d = product([ing('pecans', { name: 'Pecan halves', contains: ['pecan'] })]);
    const v = customerVerdict(d, ask(['nuts']), EU);
    expect(v.verdict).toBe('contains');
    expect(v.contains).toEqual([expect.objectContaining({ allergen: 'nuts', sources: ['pecan'], via: [['p', 'pecans']], viaContact: [] })]);
  });

  it('is told "may contain" for a composition that says "may contain nuts" without saying which, which the engine keeps as a notice only', () => {
    const d = product([ing('choc', { name: 'Dark chocolate', composition: 'Cocoa mass, sugar. May contain nuts.' })]);
    expect(d.mayContain).toEqual([]);
    const v = customerVerdict(d, ask(['nuts']), EU);
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain).toEqual([expect.objectContaining({ source: null, reason: 'composition' })]);
    // Eggs are not touched by a mention of nuts.
    expect(customerVerdict(d, ask(['eggs']), EU).verdict).toBe('suitable-as-recorded');
  });
});

describe('a customer avoiding one tree nut (walnut)', () => {
  it('is told "may contain" when a composition says "may contain nuts": walnut is not named, but may be there', () => {
    const d = product([ing('choc', { name: 'Dark chocolate', composition: 'Cocoa mass, sugar. May contain nuts.' })]);
    const v = customerVerdict(d, ask(['walnut']), EU);
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain[0]).toEqual(expect.objectContaining({ avoid: 'walnut', source: null }));
  });

  it.each([
    { title: 'a may-contain of walnut', mayContain: ['walnut' as const], verdict: 'may-contain' },
    { title: 'a may-contain of pecan only', mayContain: ['pecan' as const], verdict: 'suitable-as-recorded' },
  ])('is told $verdict for $title', ({ mayContain, verdict }) => {
    const d = product([ing('choc', { name: 'Dark chocolate', mayContain })]);
    expect(customerVerdict(d, ask(['walnut']), EU).verdict).toBe(verdict);
  });

  it('is told "suitable as recorded" for a product that contains pecan and nothing of walnut', () => {
    const d = product([ing('pecans', { name: 'Pecan halves', contains: ['pecan'] })]);
    const v = customerVerdict(d, ask(['walnut']), EU);
    expect(v).toEqual({ verdict: 'suitable-as-recorded', contains: [], mayContain: [], notKnown: [], exempt: [], claims: [] });
  });

  it('is told "may contain" for a pecan product whose chocolate may contain walnut, although the declaration folds it into "contains tree nuts"', () => {
    const d = product([
      ing('pecans', { name: 'Pecan halves', contains: ['pecan'] }),
      ing('choc', { name: 'Dark chocolate', mayContain: ['walnut'] }),
    ]);
    expect(d.mayContain).toEqual([]);
    const v = customerVerdict(d, ask(['walnut']), EU);
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain).toEqual([expect.objectContaining({ source: 'walnut', reason: 'supplier', ingredientName: 'Dark chocolate' })]);
    // Read out as well: the walnut is a source the product does not have, though it has the group.
    expect(readAloud(d, EU).mayContain).toEqual(['The supplier of Dark chocolate says it may contain walnut.']);
  });

  it('is told "may contain" for a pecan product made on the kitchen\'s equipment shared with walnut', () => {
    const d = product(
      [ing('pecans', { name: 'Pecan halves', contains: ['pecan'] })],
      [{ allergen: 'walnut', controls: 'shared-equipment' }],
    );
    const v = customerVerdict(d, ask(['walnut']), EU);
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain).toEqual([expect.objectContaining({ source: 'walnut', reason: 'kitchen', controls: 'shared-equipment' })]);
  });

  it('is told "suitable as recorded" when the kitchen keeps walnut apart', () => {
    const d = product([ing('sugar', { name: 'Sugar' })], [{ allergen: 'walnut', controls: 'segregated' }]);
    expect(customerVerdict(d, ask(['walnut']), EU).verdict).toBe('suitable-as-recorded');
  });

  it('under ANZ, where each tree nut is its own group (FSANZ Schedule 9), reads walnut as that group', () => {
    const d = product([ing('choc', { name: 'Dark chocolate', mayContain: ['walnut'] })], [], 'ANZ');
    const v = customerVerdict(d, ask(['walnut']), rulesOf('ANZ'));
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain[0]).toEqual(expect.objectContaining({ allergen: 'walnut', source: 'walnut' }));
  });
});

describe('unknown data', () => {
  const withSprinkles = (extra: IngredientInput[] = []) =>
    product([ing('sprinkles', { name: 'Sugar sprinkles', contains: undefined }), ...extra]);

  it('is "not known", naming the ingredient with no allergen statement, never "suitable"', () => {
    const v = customerVerdict(withSprinkles(), ask(['eggs']), EU);
    expect(v.verdict).toBe('not-known');
    expect(v.notKnown).toEqual([
      expect.objectContaining({
        ingredient: 'sprinkles',
        name: 'Sugar sprinkles',
        why: 'no-allergen-statement',
        avoid: ['eggs'],
        via: [['p', 'sprinkles']],
      }),
    ]);
  });

  it('gives way to "contains" when an allergen of theirs is recorded, and the unknown is still named', () => {
    const v = customerVerdict(withSprinkles([ing('eggs', { name: 'Eggs', contains: ['egg'], vegan: false })]), ask(['eggs']), EU);
    expect(v.verdict).toBe('contains');
    expect(v.notKnown.map((n) => n.ingredient)).toEqual(['sprinkles']);
  });

  it('wins over "may contain": a statement says something, an ingredient with none says nothing', () => {
    const v = customerVerdict(withSprinkles([ing('choc', { name: 'Dark chocolate', mayContain: ['egg'] })]), ask(['eggs']), EU);
    expect(v.verdict).toBe('not-known');
    expect(v.mayContain).toHaveLength(1);
  });

  it('is "not known" for a composition that names nuts without saying which, for a customer avoiding a tree nut', () => {
    const d = product([ing('praline', { name: 'Praline paste', contains: ['milk'], composition: 'Sugar, roasted nuts, milk powder' })]);
    const v = customerVerdict(d, ask(['hazelnut']), EU);
    expect(v.verdict).toBe('not-known');
    expect(v.notKnown).toEqual([expect.objectContaining({ ingredient: 'praline', why: 'composition-unspecified', avoid: ['hazelnut'] })]);
  });
});

describe('a contact line (a floured tin)', () => {
  const b = book(
    [ing('rice', { name: 'Rice flour' }), ing('sugar', { name: 'Sugar' }), ing('flour', { name: 'Plain flour', contains: ['wheat'] })],
    [
      recipe('loaf', [['rice', 400], ['sugar', 100], { use: 'flour', qty: 5, unit: 'g', role: 'contact' }], {
        name: 'Rice loaf',
        sale: { portionG: 50 },
      }),
    ],
  );
  const d = declareProduct(b, 'loaf', refs);

  it('brings gluten that is contained, through the contact line (Regulation (EU) No 1169/2011 Article 9(1)(c))', () => {
    const v = customerVerdict(d, ask(['gluten']), EU);
    expect(v.verdict).toBe('contains');
    expect(v.contains).toEqual([
      expect.objectContaining({ sources: ['wheat'], via: [['loaf', 'flour']], viaContact: [['loaf', 'flour']] }),
    ]);
  });

  it('is read out as wheat, so gluten, from the flour it touches', () => {
    expect(readAloud(d, EU).contains).toBe('It has wheat, so gluten, from the Plain flour it touches in the making.');
  });
});

describe('wanted claims', () => {
  it('a wanted vegan claim that is not known is not suitable: "not known", with the reason', () => {
    const d = product([ing('sprinkles', { name: 'Sugar sprinkles', vegan: null })]);
    const v = customerVerdict(d, ask([], ['vegan']), EU);
    expect(v.verdict).toBe('not-known');
    expect(v.claims).toEqual([
      {
        claim: 'vegan',
        status: 'not-known',
        reasons: [expect.objectContaining({ leaf: 'sprinkles', message: 'Sugar sprinkles has no recorded vegan status.' })],
      },
    ]);
    expect(readAloud(d, EU).claims[0]).toBe('Whether it is vegan is not known: Sugar sprinkles has no recorded vegan status.');
  });

  it('a vegan claim that fails rules the product out, saying why', () => {
    const d = product([ing('honey', { name: 'Honey', vegan: false })]);
    const v = customerVerdict(d, ask([], ['vegan', 'vegetarian']), EU);
    expect(v.verdict).toBe('contains');
    expect(v.claims.map((c) => [c.claim, c.status])).toEqual([
      ['vegan', 'fails'],
      ['vegetarian', 'holds'],
    ]);
    expect(readAloud(d, EU).claims[0]).toBe('It is not vegan: Honey is recorded as not vegan.');
  });

  it('a vegan claim that holds says why it holds', () => {
    const d = product([ing('sugar', { name: 'Sugar' }), ing('cocoa', { name: 'Cocoa' })]);
    expect(customerVerdict(d, ask([], ['vegan']), EU).verdict).toBe('suitable-as-recorded');
    expect(readAloud(d, EU).claims[0]).toBe('It is vegan: none of its 3 ingredients is of animal origin, as recorded.');
  });
});

describe('two allergens of theirs in two sub-recipes', () => {
  const b = book(
    [
      ing('flour', { name: 'Rice flour' }),
      ing('eggs', { name: 'Eggs', contains: ['egg'], vegan: false }),
      ing('sesame', { name: 'Sesame seeds', contains: ['sesame'] }),
      ing('sugar', { name: 'Sugar' }),
    ],
    [
      recipe(
        'sponge',
        [
          ['flour', 200],
          ['eggs', 200],
        ],
        { name: 'Sponge' },
      ),
      recipe(
        'crumble',
        [
          ['flour', 100],
          ['sesame', 50],
          ['sugar', 50],
        ],
        { name: 'Crumble' },
      ),
      recipe(
        'cake',
        [
          ['sponge', 400],
          ['crumble', 200],
        ],
        { name: 'Sesame crumble cake', sale: { portionG: 80 } },
      ),
    ],
  );
  const d = declareProduct(b, 'cake', refs);

  it('names each and where it is from', () => {
    const v = customerVerdict(d, ask(['eggs', 'sesame']), EU);
    expect(v.verdict).toBe('contains');
    expect(v.contains.map((c) => [c.avoid, c.via])).toEqual([
      ['eggs', [['cake', 'sponge', 'eggs']]],
      ['sesame', [['cake', 'crumble', 'sesame']]],
    ]);
  });

  it('is read out by the sub-recipes’ names, in one sentence', () => {
    expect(readAloud(d, EU).contains).toBe('It has egg in the Sponge; and sesame in the Crumble.');
  });
});

describe('a product with nothing of theirs', () => {
  it('is "suitable as recorded" with nothing listed', () => {
    const d = product([ing('eggs', { name: 'Eggs', contains: ['egg'], vegan: false })], [{ allergen: 'sesame', controls: 'segregated' }]);
    expect(customerVerdict(d, ask(['sesame', 'milk'], ['vegetarian']), EU)).toEqual({
      verdict: 'suitable-as-recorded',
      contains: [],
      mayContain: [],
      notKnown: [],
      exempt: [],
      claims: [{ claim: 'vegetarian', status: 'holds', reasons: [] }],
    });
  });
});

describe("the kitchen's shared handling", () => {
  it('is a may-contain with the kitchen as the reason, read out as equipment shared with sesame', () => {
    const d = product([ing('sugar', { name: 'Sugar' })], [{ allergen: 'sesame', controls: 'shared-equipment' }]);
    const v = customerVerdict(d, ask(['sesame']), EU);
    expect(v.verdict).toBe('may-contain');
    expect(v.mayContain).toEqual([expect.objectContaining({ reason: 'kitchen', controls: 'shared-equipment', source: 'sesame' })]);
    expect(readAloud(d, EU).mayContain).toEqual(['It is made on equipment shared with sesame.']);
  });

  it('is not said again as a may-contain of a product that has sesame itself', () => {
    const d = product(
      [ing('seeds', { name: 'Sesame seeds', contains: ['sesame'] })],
      [{ allergen: 'sesame', controls: 'shared-equipment' }],
    );
    expect(readAloud(d, EU).mayContain).toEqual([]);
    expect(readAloud(d, EU).contains).toBe('It has sesame in the Sesame seeds.');
    expect(customerVerdict(d, ask(['sesame']), EU)).toMatchObject({ verdict: 'contains', mayContain: [] });
  });
});

describe('what the customer asks', () => {
  it.each([
    { avoid: ['walnuts'], message: "avoid.0: unknown allergen 'walnuts'" },
    { avoid: ['eggs', 'pine-nut'], message: 'avoid.1: pine nut is not declared under this regime' },
  ])('refuses $avoid with a message naming the entry', ({ avoid, message }) => {
    const r = resolveAsk(ask(avoid), EU);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toContain(message);
    expect(() => customerVerdict(product([]), ask(avoid), EU)).toThrow(message);
  });
});

describe('the demo kitchen (Wrenfield Lane Bakehouse, UK)', () => {
  const demo = bookSchema.parse(JSON.parse(readFileSync(join(__dirname, '..', '..', 'database', 'seeders', 'demo-book.json'), 'utf8')));
  const UK = rulesOf('UK');

  const read = (id: string) => readAloud(declareProduct(demo, id, refs), UK);

  it('says the loaf has gluten through its spelt flour and the floured tin, walnut and sesame, and why it is vegan', () => {
    const loaf = read('apricot-walnut-loaf');
    expect(loaf.contains).toBe(
      'It has spelt and wheat, so gluten, in the Wholegrain spelt flour and from the Plain wheat flour it touches in the making; walnut, so tree nuts, in the Walnut pieces; sesame in the Sesame seeds; and sulphites in the Dried apricots.',
    );
    expect(loaf.claims[0]).toBe('It is vegan: none of its 8 ingredients is of animal origin, as recorded.');
  });

  it('says the layer cake’s egg and milk once for the two sub-recipes they are in, and names its unknown sprinkles', () => {
    const cake = read('strawberry-layer-cake');
    expect(cake.contains).toBe(
      'It has wheat, so gluten, in the Vanilla sponge; and egg and milk in the Vanilla sponge and the Meringue buttercream.',
    );
    expect(cake.notKnown[0]).toBe('Not known: Sugar strands has no allergen statement, so nothing can be said of its allergens.');
    expect(cake.claims[0]).toMatch(
      /^It is not vegan: Unsalted butter contains milk \(in the Vanilla sponge and the Meringue buttercream\); /,
    );
  });

  it('gathers two suppliers saying the same may-contain into one sentence, beside the kitchen’s shared equipment', () => {
    expect(read('vegan-brownie').mayContain).toEqual([
      'It is made on equipment shared with sesame.',
      'The suppliers of Dairy-free dark chocolate 70% and Plant-based baking spread say it may contain milk.',
    ]);
  });
});
