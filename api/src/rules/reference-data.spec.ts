import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { REGIMES, type AllergenSource } from '@crumbproof/shared';
import { REFERENCE_DATA_DIR, ReferenceDataError, loadReferenceData } from './reference-data';

const refs = loadReferenceData();
const group = (regime: (typeof REGIMES)[number], code: string) => refs.regimes[regime].groups.find((g) => g.code === code);
const allSources = (regime: (typeof REGIMES)[number]) => new Set(refs.regimes[regime].groups.flatMap((g) => g.members));
const codes = (regime: (typeof REGIMES)[number]) => refs.regimes[regime].groups.map((g) => g.code);
const sorted = (xs: readonly AllergenSource[]) => [...xs].sort();

describe('reference data: the published allergen lists', () => {
  it('has rules for every regime', () => {
    expect(Object.keys(refs.regimes).sort()).toEqual([...REGIMES].sort());
  });

  it.each(['EU', 'UK'] as const)('%s has exactly the 14 groups of Annex II', (regime) => {
    // EU 1169/2011 Annex II points 1-14; UK: assimilated Regulation 1169/2011, same list (DOMAIN.md 1.3).
    expect(codes(regime)).toEqual([
      'gluten',
      'crustaceans',
      'eggs',
      'fish',
      'peanuts',
      'soybeans',
      'milk',
      'nuts',
      'celery',
      'mustard',
      'sesame',
      'sulphites',
      'lupin',
      'molluscs',
    ]);
  });

  it.each(['EU', 'UK'] as const)('%s nuts are exactly the eight of Annex II point 8 (no pine nut, no coconut)', (regime) => {
    // EU 1169/2011 Annex II point 8, an exhaustive list (Commission Notice 2017/C 428/01).
    expect(sorted(group(regime, 'nuts')!.members)).toEqual(
      sorted(['almond', 'hazelnut', 'walnut', 'cashew', 'pecan', 'brazil-nut', 'pistachio', 'macadamia']),
    );
    expect(allSources(regime).has('pine-nut')).toBe(false);
    expect(allSources(regime).has('coconut')).toBe(false);
  });

  it.each(['EU', 'UK'] as const)('%s gluten cereals include oats, spelt and khorasan wheat', (regime) => {
    // EU 1169/2011 Annex II point 1: wheat (such as spelt and khorasan wheat), rye, barley, oats or their hybridised strains.
    expect(group(regime, 'gluten')!.members).toEqual(expect.arrayContaining(['wheat', 'spelt', 'khorasan', 'rye', 'barley', 'oats']));
    expect(refs.regimes[regime].sourceNames.spelt).toEqual({ name: 'spelt', also: 'wheat' });
  });

  it('US has exactly the nine major allergens of FALCPA and the FASTER Act', () => {
    // FALCPA (Pub. L. 108-282) and the FASTER Act (Pub. L. 117-11): sesame is the ninth.
    expect(codes('US')).toEqual(['milk', 'eggs', 'fish', 'crustacean-shellfish', 'tree-nuts', 'peanuts', 'wheat', 'soybeans', 'sesame']);
  });

  it('US tree nuts are the twelve of FDA Edition 5 Table 1 (a whitelist; no coconut)', () => {
    // FDA Q&A on food allergens Edition 5 (Jan 2025) Table 1: the three walnuts (English, black, California)
    // and heartnut are species of walnut here; pine nut is in; coconut is out.
    expect(sorted(group('US', 'tree-nuts')!.members)).toEqual(
      sorted(['almond', 'brazil-nut', 'cashew', 'hazelnut', 'macadamia', 'pecan', 'pine-nut', 'pistachio', 'walnut']),
    );
    expect(allSources('US').has('coconut')).toBe(false);
  });

  it.each([
    { source: 'mollusc' as const, why: 'molluscan shellfish are not major food allergens (FD&C Act 201(qq), from memory; DOMAIN.md 1.4)' },
    { source: 'oats' as const, why: 'oats are not a major food allergen (FALCPA)' },
    { source: 'celery' as const, why: 'not on the FALCPA list' },
    { source: 'mustard' as const, why: 'not on the FALCPA list' },
    { source: 'lupin' as const, why: 'not on the FALCPA list' },
  ])('US does not declare $source: $why', ({ source }) => {
    expect(allSources('US').has(source)).toBe(false);
  });

  it('Canada includes pine nut, mustard, molluscs, triticale and gluten sources', () => {
    // Canada FDR B.01.010.1(1) (a), (d), (i), (k) and the definition of "gluten".
    expect(group('CA', 'tree-nuts')!.members).toContain('pine-nut');
    expect(group('CA', 'mustard')!.members).toEqual(['mustard']);
    expect(group('CA', 'molluscs')!.members).toEqual(['mollusc']);
    expect(group('CA', 'wheat')!.members).toContain('triticale');
    expect(sorted(group('CA', 'gluten')!.members)).toEqual(sorted(['barley', 'oats', 'rye', 'triticale', 'wheat', 'spelt', 'khorasan']));
    expect(allSources('CA').has('coconut')).toBe(false);
    expect(allSources('CA').has('lupin')).toBe(false);
  });

  it('ANZ has no celery or mustard, names nuts and cereals individually and requires gluten', () => {
    // FSANZ Schedule 9 / PEAL (P1044): tree nuts and cereals declared separately; "gluten" in the summary.
    expect(allSources('ANZ').has('celery')).toBe(false);
    expect(allSources('ANZ').has('mustard')).toBe(false);
    expect(codes('ANZ')).toEqual(
      expect.arrayContaining(['wheat', 'barley', 'oats', 'rye', 'gluten', 'pine-nut', 'almond', 'mollusc', 'lupin', 'sulphites']),
    );
    expect(group('ANZ', 'gluten')!.members).toEqual(expect.arrayContaining(['wheat', 'barley', 'oats', 'rye']));
  });

  it.each([
    // EU 1169/2011 Annex II point 12: more than 10 mg/kg; Canada FDR B.01.010.1: 10 p.p.m. or more;
    // FSANZ Schedule 9: 10 mg/kg or more; US 21 CFR 101.100(a)(4): 10 ppm or more (from memory).
    { regime: 'EU' as const, comparison: 'gt' },
    { regime: 'UK' as const, comparison: 'gt' },
    { regime: 'CA' as const, comparison: 'gte' },
    { regime: 'ANZ' as const, comparison: 'gte' },
    { regime: 'US' as const, comparison: 'gte' },
  ])('$regime declares sulphites from 10 mg/kg with "$comparison"', ({ regime, comparison }) => {
    expect(refs.regimes[regime].sulphites).toMatchObject({ thresholdMgPerKg: 10, comparison });
  });

  it.each([
    // Reg 828/2014: no more than 20 mg/kg; 21 CFR 101.91: below 20 ppm; ANZ: no detectable gluten, no oats (from memory).
    { regime: 'EU' as const, limit: 20, comparison: 'lte', oats: 'gluten-cereal' },
    { regime: 'US' as const, limit: 20, comparison: 'lt', oats: 'measured' },
    { regime: 'CA' as const, limit: 20, comparison: 'lte', oats: 'gluten-cereal' },
    { regime: 'ANZ' as const, limit: 0, comparison: 'lte', oats: 'not-permitted' },
  ])('$regime gluten-free: $comparison $limit mg/kg, oats $oats', ({ regime, limit, comparison, oats }) => {
    expect(refs.regimes[regime].glutenFree).toMatchObject({ limitMgPerKg: limit, comparison, oats });
  });

  it.each([
    // EU 1169/2011 Annex II 1(a), 1(b), 6(a), 7(b): exempt; FD&C Act 201(qq): only highly refined oils (from memory).
    { regime: 'EU' as const, source: 'wheat' as const, form: 'glucose-syrup' as const, exempt: true },
    { regime: 'EU' as const, source: 'wheat' as const, form: 'maltodextrin' as const, exempt: true },
    { regime: 'EU' as const, source: 'soy' as const, form: 'refined-oil' as const, exempt: true },
    { regime: 'EU' as const, source: 'peanut' as const, form: 'refined-oil' as const, exempt: false },
    { regime: 'EU' as const, source: 'milk' as const, form: 'lactitol' as const, exempt: true },
    { regime: 'US' as const, source: 'wheat' as const, form: 'glucose-syrup' as const, exempt: false },
    { regime: 'US' as const, source: 'peanut' as const, form: 'refined-oil' as const, exempt: true },
    { regime: 'US' as const, source: 'soy' as const, form: 'refined-oil' as const, exempt: true },
    { regime: 'CA' as const, source: 'wheat' as const, form: 'glucose-syrup' as const, exempt: false },
  ])('$regime: $source as $form exempt = $exempt', ({ regime, source, form, exempt }) => {
    const found = refs.regimes[regime].exemptions.some((e) => e.source === source && e.form === form && !e.declared);
    expect(found).toBe(exempt);
  });

  it('names the published source of every group', () => {
    for (const regime of REGIMES) for (const g of refs.regimes[regime].groups) expect(g.source.length).toBeGreaterThan(10);
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
