import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ALLERGEN_SOURCES, REGIMES, type AllergenSource, type Regime, type SourceEntry } from '@crumbproof/shared';
import { declare } from './core/declare';
import { book, ing, recipe } from './core/testing/book-builder';
import { REFERENCE_DATA_DIR, ReferenceDataError, loadReferenceData } from './reference-data';

const refs = loadReferenceData();

/**
 * A product with one 10 g line of each entry (dried apricots stated at 1000 mg/kg of SO2 when
 * sulphites are among them, so sulphites are well over every regime's 10 mg/kg), declared under
 * `regime`: the labels of what it contains, in the regime's order.
 */
function declared(regime: Regime, entries: SourceEntry[]) {
  const b = book(
    entries.map((entry, i) =>
      ing(`x${i}`, { name: `Ingredient ${i}`, contains: [entry], sulphiteMgPerKg: entry === 'sulphites' ? 1000 : undefined }),
    ),
    [
      recipe(
        'p',
        entries.map((_, i) => [`x${i}`, 10] as [string, number]),
        { name: 'Product' },
      ),
    ],
    {},
    regime,
  );
  return declare(b, 'p', refs);
}
const labels = (regime: Regime, entries: SourceEntry[]) => declared(regime, entries).contains.map((c) => c.label);
const sourcesOf = (regime: Regime, code: string) =>
  [...(declared(regime, [...ALLERGEN_SOURCES]).contains.find((c) => c.allergen === code)?.sources ?? [])].sort();
const sorted = (xs: readonly AllergenSource[]) => [...xs].sort();

describe('reference data: the published allergen lists, as declared', () => {
  it('has rules for every regime', () => {
    expect(Object.keys(refs.regimes).sort()).toEqual([...REGIMES].sort());
  });

  it.each(['EU', 'UK'] as const)('%s declares the fourteen substances of Annex II, by their Annex II names, in its order', (regime) => {
    // Regulation (EU) No 1169/2011 Annex II points 1-14 (UK: the assimilated Regulation on legislation.gov.uk, the
    // same list; that GB has not amended Annex II is from memory).
    expect(labels(regime, [...ALLERGEN_SOURCES])).toEqual([
      'cereals containing gluten',
      'crustaceans',
      'eggs',
      'fish',
      'peanuts',
      'soybeans',
      'milk',
      'nuts',
      'celery',
      'mustard',
      'sesame seeds',
      'sulphur dioxide and sulphites',
      'lupin',
      'molluscs',
    ]);
  });

  it.each(['EU', 'UK'] as const)('%s nuts are the eight of Annex II point 8, and pine nut and coconut are not declared', (regime) => {
    // Annex II point 8 names almonds, hazelnuts, walnuts, cashews, pecan nuts, Brazil nuts, pistachio nuts and
    // macadamia nuts; Commission Notice 2017/C 428/01 reads the list as exhaustive.
    expect(sourcesOf(regime, 'nuts')).toEqual(
      sorted(['almond', 'hazelnut', 'walnut', 'cashew', 'pecan', 'brazil-nut', 'pistachio', 'macadamia']),
    );
    expect(labels(regime, ['pine-nut', 'coconut'])).toEqual([]);
  });

  it.each(['EU', 'UK'] as const)('%s: spelt and khorasan are cereals containing gluten and the list refers to wheat', (regime) => {
    // Annex II point 1: "wheat (such as spelt and khorasan wheat), rye, barley, oats or their hybridised strains";
    // Commission Notice 2017/C 428/01: where spelt or khorasan is named, the label also refers to wheat.
    expect(sourcesOf(regime, 'gluten')).toEqual(sorted(['wheat', 'spelt', 'khorasan', 'triticale', 'rye', 'barley', 'oats']));
    const d = declare(
      book([ing('spelt', { name: 'Wholegrain spelt flour', contains: ['spelt'] })], [recipe('p', [['spelt', 100]])], {}, regime),
      'p',
      refs,
    );
    expect(d.ingredientsText).toBe('Ingredients: Wholegrain spelt flour (wheat).');
  });

  it('US declares the nine major food allergens of FALCPA and the FASTER Act, and nothing else', () => {
    // FD&C Act 201(qq) as amended by FALCPA (Pub. L. 108-282) and the FASTER Act (Pub. L. 117-11): sesame is the ninth.
    expect(labels('US', [...ALLERGEN_SOURCES])).toEqual([
      'milk',
      'eggs',
      'fish',
      'crustacean shellfish',
      'tree nuts',
      'peanuts',
      'wheat',
      'soybeans',
      'sesame',
    ]);
  });

  it('US tree nuts are those of FDA Edition 5 Table 1; coconut is not one', () => {
    // FDA Q&A on food allergens, Edition 5 (January 2025), Table 1: almond, black walnut, Brazil nut, California
    // walnut, cashew, filbert/hazelnut, heartnut, macadamia, pecan, pine nut, pistachio, walnut (the walnuts and
    // heartnut are species of walnut here); coconut is no longer a tree nut.
    expect(sourcesOf('US', 'tree-nuts')).toEqual(
      sorted(['almond', 'brazil-nut', 'cashew', 'hazelnut', 'macadamia', 'pecan', 'pine-nut', 'pistachio', 'walnut']),
    );
    expect(labels('US', ['coconut'])).toEqual([]);
  });

  it.each([
    {
      source: 'mollusc' as const,
      why: 'molluscan shellfish are not major food allergens (FD&C Act 201(qq) names Crustacean shellfish; from memory)',
    },
    { source: 'oats' as const, why: 'oats are not a major food allergen (FD&C Act 201(qq))' },
    { source: 'celery' as const, why: 'not in FD&C Act 201(qq)' },
    { source: 'mustard' as const, why: 'not in FD&C Act 201(qq)' },
    { source: 'lupin' as const, why: 'not in FD&C Act 201(qq)' },
  ])('US does not declare $source: $why', ({ source }) => {
    expect(labels('US', [source])).toEqual([]);
  });

  it('Canada declares its food allergens, gluten sources and sulphites (B.01.010.1(1)), not lupin, celery or coconut', () => {
    // Food and Drug Regulations B.01.010.1(1): (a) the nine tree nuts with pine nuts, (b) peanuts, (c) sesame seeds,
    // (d) wheat or triticale, (e) eggs, (f) milk, (g) soybeans, (h) crustaceans, (i) molluscs, (j) fish, (k) mustard
    // seeds; "gluten" from barley, oats, rye, triticale, wheat; added sulphites (10 p.p.m. or more).
    expect(labels('CA', [...ALLERGEN_SOURCES])).toEqual([
      'tree nuts',
      'peanuts',
      'sesame seeds',
      'wheat or triticale',
      'eggs',
      'milk',
      'soybeans',
      'crustaceans',
      'molluscs',
      'fish',
      'mustard seeds',
      'gluten sources',
      'sulphites',
    ]);
    expect(sourcesOf('CA', 'tree-nuts')).toContain('pine-nut');
    expect(labels('CA', ['lupin', 'celery', 'coconut'])).toEqual([]);
  });

  it('ANZ names tree nuts and cereals one by one with gluten, and has no celery or mustard', () => {
    // Food Standards Code Schedule 9 (PEAL, Proposal P1044): tree nuts and gluten cereals declared separately,
    // "gluten" in the summary for wheat, barley, oats and rye; no celery or mustard requirement.
    expect(labels('ANZ', ['oats'])).toEqual(['oats', 'gluten']);
    expect(labels('ANZ', ['pine-nut', 'almond'])).toEqual(['almond', 'pine nut']);
    expect(labels('ANZ', ['mollusc', 'lupin', 'sulphites'])).toEqual(['lupin', 'mollusc', 'sulphites']);
    expect(labels('ANZ', ['celery', 'mustard'])).toEqual([]);
  });

  it.each([
    // Regulation (EU) No 1169/2011 Annex II 1(a) wheat based glucose syrups, 1(b) wheat based maltodextrins,
    // 6(a) fully refined soybean oil, 7(b) lactitol: not declared; there is no exception for peanut oil.
    { regime: 'EU' as const, source: 'wheat' as const, form: 'glucose-syrup' as const, declares: [] as string[] },
    { regime: 'EU' as const, source: 'wheat' as const, form: 'maltodextrin' as const, declares: [] as string[] },
    { regime: 'EU' as const, source: 'soy' as const, form: 'refined-oil' as const, declares: [] as string[] },
    { regime: 'EU' as const, source: 'peanut' as const, form: 'refined-oil' as const, declares: ['peanuts'] },
    { regime: 'EU' as const, source: 'milk' as const, form: 'lactitol' as const, declares: [] as string[] },
    // FD&C Act 201(qq): only highly refined oils are outside the definition (from memory).
    { regime: 'US' as const, source: 'wheat' as const, form: 'glucose-syrup' as const, declares: ['wheat'] },
    { regime: 'US' as const, source: 'peanut' as const, form: 'refined-oil' as const, declares: [] as string[] },
    { regime: 'US' as const, source: 'soy' as const, form: 'refined-oil' as const, declares: [] as string[] },
    // Food and Drug Regulations B.01.010.1: no exempt forms recorded (from memory).
    { regime: 'CA' as const, source: 'wheat' as const, form: 'glucose-syrup' as const, declares: ['wheat or triticale', 'gluten sources'] },
  ])('$regime: $source as $form declares $declares', ({ regime, source, form, declares }) => {
    const d = declared(regime, [{ source, form }]);
    expect(d.contains.map((c) => c.label)).toEqual(declares);
    expect(d.exempt.length > 0).toBe(declares.length === 0);
  });
});

describe('loadReferenceData', () => {
  const copyWith = (file: string, edit: (json: Record<string, unknown>) => void) => {
    const dir = mkdtempSync(join(tmpdir(), 'refs-'));
    for (const f of ['regimes.json', 'lexicon.json']) {
      const json = JSON.parse(readFileSync(join(REFERENCE_DATA_DIR, f), 'utf8')) as Record<string, unknown>;
      if (f === file) edit(json);
      writeFileSync(join(dir, f), JSON.stringify(json));
    }
    return dir;
  };

  it.each([
    {
      title: 'an unknown allergen source',
      file: 'regimes.json',
      edit: (j: Record<string, unknown>) => {
        (j as { regimes: { EU: { groups: Array<{ members: string[] }> } } }).regimes.EU.groups[0].members.push('quinoa');
      },
    },
    {
      title: 'a regime left out',
      file: 'regimes.json',
      edit: (j: Record<string, unknown>) => {
        delete (j as { regimes: Record<string, unknown> }).regimes.ANZ;
      },
    },
    {
      title: 'a rule with no source',
      file: 'regimes.json',
      edit: (j: Record<string, unknown>) => {
        (j as { regimes: { US: { sulphites: { basis: string } } } }).regimes.US.sulphites.basis = '';
      },
    },
    {
      title: 'a lexicon term with no source',
      file: 'lexicon.json',
      edit: (j: Record<string, unknown>) => {
        (j as { allergenTerms: unknown[] }).allergenTerms.push({ term: 'quark' });
      },
    },
  ])('fails loudly on $title', ({ file, edit }) => {
    const dir = copyWith(file, edit);
    expect(() => loadReferenceData(dir)).toThrow(ReferenceDataError);
    expect(() => loadReferenceData(dir)).toThrow(file);
  });

  it('fails loudly when a file is missing', () => {
    expect(() => loadReferenceData(join(tmpdir(), 'no-such-reference-data'))).toThrow(/Cannot read reference data/);
  });
});
