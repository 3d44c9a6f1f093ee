import type { BookInput, Claim, Regime } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();
type IngredientInput = BookInput['ingredients'][number];

/** A two-line product: a plain base and the ingredient under test. */
function claimOf(
  claim: Claim,
  extra: Partial<IngredientInput>,
  opts: { regime?: Regime; handles?: BookInput['site']['handles']; base?: Partial<IngredientInput> } = {},
) {
  const b = book(
    [ing('base', { name: 'Rice flour', ...opts.base }), ing('x', { name: 'Test ingredient', ...extra })],
    [
      recipe(
        'p',
        [
          ['base', 900],
          ['x', 100],
        ],
        { name: 'Product', finishedWeightG: 1000, sale: { portionG: 50, claims: [claim] } },
      ),
    ],
    { handles: opts.handles ?? [] },
    opts.regime ?? 'EU',
  );
  return declare(b, 'p', refs);
}

describe('a claim that fails through a contact line says so in its reason', () => {
  // A plant-based batter cooked on a griddle greased with butter: the butter is in the food
  // (Regulation (EU) No 1169/2011 Article 9(1)(c) declares what is used and still present), so the
  // vegan claim fails; the reason names the contact line, as the contains list does.
  const griddled = book(
    [
      ing('flour', { name: 'Plain wheat flour', contains: ['wheat'] }),
      ing('oat-drink', { name: 'Oat drink', contains: ['oats'] }),
      ing('butter', { name: 'Unsalted butter', contains: ['milk'], vegan: false }),
    ],
    [
      recipe('batter', [
        ['flour', 200],
        ['oat-drink', 300],
      ]),
      recipe('pancakes', [['batter', 500], { use: 'butter', role: 'contact' }], {
        name: 'Griddle pancakes',
        sale: { portionG: 100, claims: ['vegan', 'dairy-free'] },
      }),
      recipe('floured', [['oat-drink', 100], { use: 'batter', role: 'contact' }], { name: 'Floured', sale: { portionG: 50 } }),
    ],
  );

  it('vegan and dairy-free fail on the butter greasing the griddle, each reason naming the contact line', () => {
    const d = declare(griddled, 'pancakes', refs);
    expect(d.claims.vegan.status).toBe('fails');
    expect(d.claims.vegan.reasons.map((r) => [r.path, r.message])).toEqual([
      [['pancakes', 'butter'], 'Unsalted butter is recorded as not vegan (through a contact line: greasing or dusting).'],
      [['pancakes', 'butter'], 'Unsalted butter contains milk (through a contact line: greasing or dusting).'],
    ]);
    expect(d.claims['dairy-free'].reasons.map((r) => r.message)).toEqual([
      'Unsalted butter contains milk (through a contact line: greasing or dusting).',
    ]);
    expect(d.errors.map((e) => e.message).join(' ')).toContain('(through a contact line: greasing or dusting)');
  });

  it('a weighed line says nothing of contact, and a leaf under a sub-recipe used as a contact line says it too', () => {
    const weighed = declare(griddled, 'batter', refs);
    expect(weighed.claims['gluten-free'].reasons.map((r) => r.message)).toEqual([
      'Plain wheat flour contains wheat with no measured gluten figure.',
      'Oat drink contains oats with no measured gluten figure.',
    ]);
    const dusted = declare(griddled, 'floured', refs);
    expect(dusted.claims['gluten-free'].reasons.map((r) => [r.path, r.message])).toEqual(
      expect.arrayContaining([
        [
          ['floured', 'batter', 'flour'],
          'Plain wheat flour contains wheat with no measured gluten figure (through a contact line: greasing or dusting).',
        ],
      ]),
    );
  });
});

describe('vegan and vegetarian', () => {
  it.each([
    // Common practice: vegan and vegetarian follow the recorded status and animal sources.
    { title: 'all leaves vegan', extra: {}, vegan: 'ok', vegetarian: 'ok' },
    { title: 'a leaf recorded not vegan', extra: { vegan: false }, vegan: 'fails', vegetarian: 'ok' },
    { title: 'a leaf with unknown vegan status', extra: { vegan: null }, vegan: 'unverified', vegetarian: 'ok' },
    { title: 'a leaf with unknown vegetarian status', extra: { vegetarian: null }, vegan: 'ok', vegetarian: 'unverified' },
    { title: 'milk in the allergen list', extra: { contains: ['milk' as const] }, vegan: 'fails', vegetarian: 'ok' },
    { title: 'fish in the allergen list', extra: { contains: ['fish' as const] }, vegan: 'fails', vegetarian: 'fails' },
    { title: 'gelatine in the composition', extra: { composition: 'Sugar, beef gelatine' }, vegan: 'fails', vegetarian: 'fails' },
    { title: 'shellac in the composition', extra: { composition: 'Glaze (shellac)' }, vegan: 'fails', vegetarian: 'ok' },
    {
      title: 'honey in the composition',
      extra: { composition: 'Honey, oats', contains: ['oats' as const] },
      vegan: 'fails',
      vegetarian: 'ok',
    },
    { title: 'vitamin D3 of unstated origin', extra: { composition: 'Vitamin D3' }, vegan: 'unverified', vegetarian: 'ok' },
    {
      title: 'unknown status and an animal product (fails wins)',
      extra: { vegan: null, contains: ['egg' as const] },
      vegan: 'fails',
      vegetarian: 'ok',
    },
    { title: 'a may-contain of milk only', extra: { mayContain: ['milk' as const] }, vegan: 'ok', vegetarian: 'ok' },
  ])('$title: vegan $vegan, vegetarian $vegetarian', ({ extra, vegan, vegetarian }) => {
    const d = claimOf('vegan', extra);
    expect(d.claims.vegan.status).toBe(vegan);
    expect(d.claims.vegetarian.status).toBe(vegetarian);
  });

  it('says which leaf, by which path, and why', () => {
    const d = claimOf('vegan', { vegan: false, name: 'Butter' });
    expect(d.claims.vegan.reasons).toEqual([{ leaf: 'x', path: ['p', 'x'], message: 'Butter is recorded as not vegan.' }]);
  });

  it('warns that vegan is not dairy-free when the product may contain milk', () => {
    const d = claimOf('vegan', { mayContain: ['milk'] });
    expect(d.claims.vegan.status).toBe('ok');
    expect(d.claims['dairy-free'].status).toBe('fails');
    expect(d.warnings.map((w) => w.code)).toContain('vegan-not-dairy-free');
  });

  it('warns when a leaf recorded vegan names an animal product', () => {
    const d = claimOf('vegan', { vegan: true, composition: 'Sugar, whey powder' });
    expect(d.claims.vegan.status).toBe('fails');
    expect(d.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['composition-discrepancy', 'dietary-discrepancy']));
  });
});

describe('free-from claims', () => {
  it.each([
    // Product rule: fails on any contains or may-contain; unverified when a leaf has no allergen statement.
    { claim: 'egg-free' as const, extra: { contains: ['egg' as const] }, status: 'fails' },
    { claim: 'egg-free' as const, extra: { mayContain: ['egg' as const] }, status: 'fails' },
    { claim: 'egg-free' as const, extra: { contains: undefined }, status: 'unverified' },
    { claim: 'egg-free' as const, extra: { contains: [] }, status: 'ok' },
    { claim: 'dairy-free' as const, extra: { composition: 'Sugar, skimmed milk powder' }, status: 'fails' },
    { claim: 'dairy-free' as const, extra: { composition: 'Cocoa butter, coconut milk' }, status: 'ok' },
    { claim: 'peanut-free' as const, extra: { contains: ['peanut' as const] }, status: 'fails' },
    { claim: 'sesame-free' as const, extra: { composition: 'Tahini' }, status: 'fails' },
    { claim: 'nut-free' as const, extra: { contains: ['hazelnut' as const] }, status: 'fails' },
    { claim: 'nut-free' as const, extra: { contains: undefined, mayContain: ['almond' as const] }, status: 'fails' },
    // Composition texts (common practice): a vague "nuts" cannot be proved either way; "may contain nuts" is a may-contain.
    { claim: 'nut-free' as const, extra: { composition: 'Mixed nuts, honey' }, status: 'unverified' },
    { claim: 'nut-free' as const, extra: { composition: 'Sugar, cocoa. May contain traces of nuts.' }, status: 'fails' },
    { claim: 'nut-free' as const, extra: { composition: 'Nutmeg, cinnamon, coconut' }, status: 'ok' },
    { claim: 'dairy-free' as const, extra: { composition: 'Cocoa mass, sugar. May contain milk.' }, status: 'fails' },
    { claim: 'gluten-free' as const, extra: { composition: 'Starch, gluten' }, status: 'unverified' },
  ])('$claim with $extra → $status', ({ claim, extra, status }) => {
    expect(claimOf(claim, extra).claims[claim].status).toBe(status);
  });

  it.each([
    // Each regime's list decides: EU Annex II point 8 (no pine nut, no coconut); FDA Ed. 5 Table 1 (pine nut, no coconut).
    { regime: 'EU' as const, nut: 'pine-nut' as const, status: 'ok' },
    { regime: 'US' as const, nut: 'pine-nut' as const, status: 'fails' },
    { regime: 'CA' as const, nut: 'pine-nut' as const, status: 'fails' },
    { regime: 'EU' as const, nut: 'coconut' as const, status: 'ok' },
    { regime: 'US' as const, nut: 'coconut' as const, status: 'ok' },
  ])('nut-free in $regime with $nut: $status', ({ regime, nut, status }) => {
    expect(claimOf('nut-free', { contains: [nut] }, { regime }).claims['nut-free'].status).toBe(status);
  });

  it.each([
    // Product rule: shared equipment or area gives a may-contain; segregated gives none.
    { controls: 'shared-equipment' as const, status: 'fails' },
    { controls: 'shared-area' as const, status: 'fails' },
    { controls: 'segregated' as const, status: 'ok' },
  ])('sesame handled with $controls in the kitchen: sesame-free $status', ({ controls, status }) => {
    const d = claimOf('sesame-free', {}, { handles: [{ allergen: 'sesame', controls }] });
    expect(d.claims['sesame-free'].status).toBe(status);
    if (status === 'fails') expect(d.claims['sesame-free'].reasons[0]).toMatchObject({ leaf: null, path: [] });
  });

  it('fails wins over unverified', () => {
    const d = claimOf('egg-free', { contains: ['egg'] }, { base: { contains: undefined } });
    expect(d.claims['egg-free'].status).toBe('fails');
    expect(d.claims['egg-free'].reasons.map((r) => r.leaf)).toEqual(['x', 'base']);
  });
});

// The 20 mg/kg limit of every regime, at, above and below, is checked in thresholds.spec.ts.
describe('gluten-free', () => {
  it('fails a gluten cereal without a measured figure', () => {
    const d = claimOf('gluten-free', { name: 'Plain wheat flour', contains: ['wheat'] });
    expect(d.claims['gluten-free']).toEqual({
      status: 'fails',
      reasons: [{ leaf: 'x', path: ['p', 'x'], message: 'Plain wheat flour contains wheat with no measured gluten figure.' }],
    });
    expect(d.errors.map((e) => e.code)).toEqual(['claim-not-met']);
  });

  it('leaves an exempt form without a figure unverified (wheat glucose syrup, EU Annex II 1(a))', () => {
    const d = claimOf('gluten-free', { name: 'Glucose syrup', contains: [{ source: 'wheat', form: 'glucose-syrup' }] });
    expect(d.claims['gluten-free'].status).toBe('unverified');
  });

  it.each([
    // Oats: EU gluten cereal (Annex II point 1; Reg 828/2014 Annex B: at most 20 mg/kg);
    // US: not a gluten-containing grain (21 CFR 101.91), but no figure → cannot be proved;
    // ANZ: oats not permitted in a gluten-free food (from memory).
    { regime: 'EU' as const, figure: undefined, status: 'fails' },
    { regime: 'EU' as const, figure: 10, status: 'ok' },
    { regime: 'US' as const, figure: undefined, status: 'unverified' },
    { regime: 'US' as const, figure: 10, status: 'ok' },
    { regime: 'ANZ' as const, figure: 0, status: 'fails' },
  ])('oats in $regime with figure $figure: $status', ({ regime, figure, status }) => {
    const d = claimOf('gluten-free', { name: 'Gluten-free oats', contains: ['oats'], glutenMgPerKg: figure }, { regime });
    expect(d.claims['gluten-free'].status).toBe(status);
  });

  it('fails on a may-contain of a gluten cereal and on shared handling of wheat', () => {
    expect(claimOf('gluten-free', { mayContain: ['barley'] }).claims['gluten-free'].status).toBe('fails');
    expect(claimOf('gluten-free', {}, { handles: [{ allergen: 'wheat', controls: 'shared-area' }] }).claims['gluten-free'].status).toBe(
      'fails',
    );
  });

  it('is ok for a product without gluten cereals whose leaves all have allergen statements', () => {
    expect(claimOf('gluten-free', {}).claims['gluten-free']).toEqual({ status: 'ok', reasons: [] });
  });
});

describe('claims on the declaration', () => {
  it('always gives all eight claims', () => {
    expect(Object.keys(claimOf('vegan', {}).claims).sort()).toEqual([
      'dairy-free',
      'egg-free',
      'gluten-free',
      'nut-free',
      'peanut-free',
      'sesame-free',
      'vegan',
      'vegetarian',
    ]);
  });

  it('blocks a requested claim that is only unverified', () => {
    const d = claimOf('vegan', { vegan: null });
    expect(d.errors).toEqual([expect.objectContaining({ code: 'claim-not-met' })]);
    expect(d.errors[0].message).toContain('cannot be verified');
  });

  it('raises no error for a claim that is not requested', () => {
    expect(claimOf('egg-free', { vegan: false }).errors).toEqual([]);
  });
});
