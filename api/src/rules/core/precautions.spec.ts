import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { book, ing, recipe } from './testing/book-builder';

/**
 * The precautionary statements a declaration keeps with their sources, and the compositions that
 * name an allergen without saying which. The counter answers a customer avoiding one source (one
 * tree nut) from these, never from the sentences of the may-contain line.
 */
const refs = loadReferenceData();

describe('precautions: every statement with the source it names', () => {
  const tart = (handles: Parameters<typeof book>[2] = {}, regime: Parameters<typeof book>[3] = 'EU') =>
    declare(
      book(
        [
          ing('pecans', { name: 'Pecan halves', contains: ['pecan'] }),
          ing('choc', { name: 'Dark chocolate', contains: ['soy'], mayContain: ['walnut', 'milk'] }),
          ing('flour', { name: 'Plain flour', contains: ['wheat'] }),
          ing('pine', { name: 'Pine kernels', contains: [], mayContain: ['pine-nut'] }),
        ],
        [
          recipe('base', [
            ['flour', 200],
            ['choc', 50],
          ]),
          recipe(
            'tart',
            [
              ['base', 250],
              ['pecans', 100],
              ['choc', 30],
              ['pine', 10],
            ],
            { sale: { portionG: 50 } },
          ),
        ],
        handles,
        regime,
      ),
      'tart',
      refs,
    );

  it('keeps a supplier\'s "may contain walnut" in a product that has pecan, which the may-contain line leaves out', () => {
    const d = tart();
    // Regulation (EU) No 1169/2011 Annex II point 8: pecan and walnut are both nuts; the product
    // contains the group, so its may-contain line names only milk.
    expect(d.contains.map((c) => c.allergen)).toContain('nuts');
    expect(d.mayContain.map((m) => m.allergen)).toEqual(['milk']);
    const walnut = d.precautions.find((p) => p.source === 'walnut');
    expect(walnut).toEqual({
      source: 'walnut',
      allergens: ['nuts'],
      origin: 'supplier',
      ingredient: 'choc',
      ingredientName: 'Dark chocolate',
      controls: null,
      via: [
        ['tart', 'base', 'choc'],
        ['tart', 'choc'],
      ],
      message: 'Supplier of Dark chocolate: may contain walnut',
    });
  });

  it('leaves out a source the regime does not declare (pine nut under the EU list), and keeps it where it does (US tree nuts)', () => {
    expect(tart().precautions.some((p) => p.source === 'pine-nut')).toBe(false);
    const us = tart({}, 'US').precautions.find((p) => p.source === 'pine-nut');
    expect(us).toMatchObject({ allergens: ['tree-nuts'], origin: 'supplier', ingredient: 'pine' });
  });

  it("states the kitchen's shared handling with its control and no path; segregated handling gives none", () => {
    const d = tart({
      handles: [
        { allergen: 'sesame', controls: 'shared-equipment' },
        { allergen: 'egg', controls: 'shared-area' },
        { allergen: 'peanut', controls: 'segregated' },
      ],
    });
    const kitchen = d.precautions.filter((p) => p.origin === 'kitchen');
    expect(kitchen).toEqual([
      {
        source: 'sesame',
        allergens: ['sesame'],
        origin: 'kitchen',
        ingredient: null,
        ingredientName: null,
        controls: 'shared-equipment',
        via: [],
        message: 'Sesame: shared equipment in this kitchen',
      },
      expect.objectContaining({ source: 'egg', controls: 'shared-area' }),
    ]);
    expect(d.mayContain.map((m) => m.allergen)).toEqual(['eggs', 'milk', 'sesame']);
    for (const m of d.mayContain) {
      // Every reason on the may-contain line is one of the kept statements, said the same way.
      for (const why of m.why) expect(d.precautions.map((p) => p.message)).toContain(why);
    }
  });

  it('says where a composition\'s "may contain" clause comes from, apart from the supplier\'s list', () => {
    const d = declare(
      book(
        [ing('praline', { name: 'Praline paste', contains: ['hazelnut'], composition: 'Hazelnuts, sugar. May contain milk.' })],
        [recipe('bonbon', [['praline', 100]], { sale: { portionG: 50 } })],
      ),
      'bonbon',
      refs,
    );
    expect(d.precautions).toEqual([
      expect.objectContaining({
        source: 'milk',
        origin: 'composition',
        ingredient: 'praline',
        message: 'Composition of Praline paste: may contain milk',
      }),
    ]);
  });
});

describe('vague: compositions that name an allergen without saying which', () => {
  const declared = (composition: string) =>
    declare(
      book(
        [ing('crunch', { name: 'Brittle crunch', contains: [], composition })],
        [recipe('bar', [['crunch', 100]], { sale: { portionG: 50 } })],
      ),
      'bar',
      refs,
    );

  it('reads "nuts" in the composition itself as any tree nut, coconut or peanut (common practice), with its path', () => {
    const d = declared('Sugar, nuts, glucose');
    expect(d.vague).toEqual([
      {
        ingredient: 'crunch',
        name: 'Brittle crunch',
        term: 'nuts',
        precautionary: false,
        mayMean: expect.arrayContaining(['walnut', 'almond', 'pine-nut', 'coconut', 'peanut']),
        via: [['bar', 'crunch']],
        message: "The composition of Brittle crunch names nuts without saying which ('nuts'). Ask the supplier which.",
      },
    ]);
    expect(d.warnings.filter((w) => w.code === 'composition-vague').map((w) => w.message)).toEqual(d.vague.map((v) => v.message));
  });

  it('marks a "may contain nuts" clause as precautionary', () => {
    const [v] = declared('Sugar, glucose. May contain nuts.').vague;
    expect(v).toMatchObject({ term: 'nuts', precautionary: true });
    expect(v?.message).toBe(
      "The composition of Brittle crunch says it may contain 'nuts' and so names nuts without saying which. Ask the supplier which.",
    );
  });

  it('reads "shellfish" as crustaceans and molluscs, and "gluten" as every gluten cereal', () => {
    expect(declared('Stock (shellfish)').vague[0]?.mayMean).toEqual(['crustacean', 'mollusc']);
    expect(declared('Starch, gluten').vague[0]?.mayMean).toEqual(['wheat', 'rye', 'barley', 'oats', 'spelt', 'khorasan', 'triticale']);
  });
});
