import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { bookSchema, type Declaration } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare, declareAll } from './declare';
import { BookProblemsError, UnknownProductError } from './errors';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();
const FIXTURES = join(__dirname, '..', '..', '..', '..', 'tests', 'fixtures');
const fixture = (name: string): unknown => JSON.parse(readFileSync(join(FIXTURES, name), 'utf8'));

describe('the shortbread example (tests/fixtures/shortbread.book.json)', () => {
  const b = bookSchema.parse(fixture('shortbread.book.json'));
  const [d] = declareAll(b, refs).declarations;

  it('declares gluten (wheat) and milk (EU 1169/2011 Annex II points 1 and 7)', () => {
    expect(d.contains).toEqual([
      { allergen: 'gluten', label: 'cereals containing gluten', sources: ['wheat'], via: [['shortbread', 'flour']] },
      { allergen: 'milk', label: 'milk', sources: ['milk'], via: [['shortbread', 'butter']] },
    ]);
    expect(d.ingredientsMarkdown).toBe('Ingredients: Plain **wheat** flour, Butter (**milk**).');
  });

  it('fails vegan because of the butter, an error since the sale asks for vegan', () => {
    expect(d.claims.vegan.status).toBe('fails');
    expect(d.claims.vegan.reasons.every((r) => r.leaf === 'butter')).toBe(true);
    expect(d.errors.map((e) => e.code)).toEqual(['claim-not-met']);
  });

  it('matches the expected declaration checked in (tests/fixtures/shortbread.declarations.json)', () => {
    expect({ declarations: [d] }).toEqual(fixture('shortbread.declarations.json'));
  });
});

describe('declare', () => {
  const layered = () =>
    book(
      [
        ing('flour', { name: 'Wheat flour', contains: ['wheat'] }),
        ing('eggs', { name: 'Eggs', contains: ['egg'], vegan: false }),
        ing('sugar', { name: 'Sugar' }),
        ing('milk', { name: 'Whole milk', contains: ['milk'], vegan: false }),
        ing('choc', {
          name: 'Dark chocolate',
          supplier: 'Example Cocoa Ltd',
          contains: ['soy'],
          mayContain: ['hazelnut'],
          composition: 'Cocoa mass, sugar, whey powder, soya lecithin',
        }),
        ing('syrup', { name: 'Glucose syrup', contains: [{ source: 'wheat', form: 'glucose-syrup' }] }),
        ing('sprinkles', { name: 'Sugar sprinkles', contains: undefined }),
      ],
      [
        recipe(
          'sponge',
          [
            ['flour', 200],
            ['eggs', 200],
            ['sugar', 200],
          ],
          { finishedWeightG: 540 },
        ),
        recipe('cream', [
          ['milk', 300],
          ['eggs', 60],
          ['sugar', 60],
        ]),
        recipe('filling', [
          ['cream', 200],
          ['choc', 100],
        ]),
        recipe(
          'gateau',
          [
            ['sponge', 500],
            ['filling', 300],
            ['syrup', 50],
            ['sprinkles', 10],
          ],
          { finishedWeightG: 850, sale: { portionG: 85 } },
        ),
        recipe('notforsale', [['sugar', 10]]),
      ],
      {
        handles: [
          { allergen: 'sesame', controls: 'shared-equipment' },
          { allergen: 'peanut', controls: 'segregated' },
        ],
      },
    );

  it('names every path from the product to each leaf that brings an allergen, at any depth', () => {
    const d = declare(layered(), 'gateau', refs);
    expect(d.contains.find((c) => c.allergen === 'eggs')!.via).toEqual([
      ['gateau', 'sponge', 'eggs'],
      ['gateau', 'filling', 'cream', 'eggs'],
    ]);
  });

  it('counts a composition term the supplier omitted as contained, with a discrepancy warning', () => {
    const d = declare(layered(), 'gateau', refs);
    expect(d.contains.find((c) => c.allergen === 'milk')!.via).toContainEqual(['gateau', 'filling', 'choc']);
    const w = d.warnings.find((x) => x.code === 'composition-discrepancy');
    expect(w).toMatchObject({ ingredient: 'choc' });
    expect(w!.message).toContain("'whey'");
    expect(w!.message).toContain('Dark chocolate');
  });

  it('gives may-contain from suppliers and shared handling, never repeating a contained group; segregated gives none', () => {
    const d = declare(layered(), 'gateau', refs);
    expect(d.mayContain).toEqual([
      { allergen: 'nuts', label: 'nuts', why: ['Supplier of Dark chocolate: may contain hazelnut'] },
      { allergen: 'sesame', label: 'sesame seeds', why: ['Sesame: shared equipment in this kitchen'] },
    ]);
    expect(d.mayContainText).toBe('May contain: nuts, sesame seeds.');
  });

  it('reads a precautionary clause in the composition as may-contain, not contains', () => {
    const b = book(
      [ing('choc', { name: 'Cooking chocolate', composition: 'Cocoa mass, sugar; may contain milk and sesame.' })],
      [recipe('p', [['choc', 100]])],
    );
    const d = declare(b, 'p', refs);
    expect(d.contains).toEqual([]);
    expect(d.mayContain).toEqual([
      { allergen: 'milk', label: 'milk', why: ['Composition of Cooking chocolate: may contain milk'] },
      { allergen: 'sesame', label: 'sesame seeds', why: ['Composition of Cooking chocolate: may contain sesame'] },
    ]);
  });

  it('does not repeat as may-contain a group the product contains', () => {
    const b = book([ing('flour', { contains: ['wheat'], mayContain: ['wheat', 'milk'] })], [recipe('p', [['flour', 100]])], {
      handles: [{ allergen: 'wheat', controls: 'shared-area' }],
    });
    expect(declare(b, 'p', refs).mayContain.map((m) => m.allergen)).toEqual(['milk']);
  });

  it.each([
    // EU 1169/2011 Annex II 1(a): wheat based glucose syrups are not declared; the US has no such exemption (FD&C Act 201(qq)).
    { regime: 'EU' as const, declaresWheatViaSyrup: false },
    { regime: 'UK' as const, declaresWheatViaSyrup: false },
    { regime: 'US' as const, declaresWheatViaSyrup: true },
  ])(
    '$regime: wheat glucose syrup declared = $declaresWheatViaSyrup, and named in the list either way',
    ({ regime, declaresWheatViaSyrup }) => {
      const d = declare(layered(), 'gateau', refs, { regime });
      const wheat = d.contains.find((c) => c.allergen === (regime === 'US' ? 'wheat' : 'gluten'))!;
      expect(wheat.via.some((p) => p.join('/') === 'gateau/syrup')).toBe(declaresWheatViaSyrup);
      expect(d.exempt.map((e) => e.ingredient)).toEqual(declaresWheatViaSyrup ? [] : ['syrup']);
      expect(d.ingredientsText).toContain('Glucose syrup');
    },
  );

  it('names the exemption by its point of Regulation (EU) No 1169/2011 Annex II, in words a reader can use', () => {
    const d = declare(layered(), 'gateau', refs, { regime: 'EU' });
    expect(d.exempt[0].basis).toMatch(/Annex II 1\(a\)/);
    const notice = d.warnings.find((w) => w.code === 'exempt-form')!;
    expect(notice.message).toMatch(/Annex II 1\(a\)/);
    // reference-data/regimes.json tags each citation with how it was confirmed; readers never see the tag.
    expect(`${d.exempt[0].basis} ${notice.message}`).not.toMatch(/\[(read|memory)\]/);
  });

  it('US: fully refined soybean oil is not declared (FD&C Act 201(qq) highly refined oils, from memory)', () => {
    const b = book(
      [ing('oil', { name: 'Soybean oil', contains: [{ source: 'soy', form: 'refined-oil' }] }), ing('flour', { contains: ['wheat'] })],
      [
        recipe('p', [
          ['flour', 100],
          ['oil', 10],
        ]),
      ],
      {},
      'US',
    );
    const d = declare(b, 'p', refs);
    expect(d.contains.map((c) => c.allergen)).toEqual(['wheat']);
    expect(d.ingredientsText).toBe('Ingredients: Flour, Soybean oil. Contains: wheat.');
  });

  it('models a leaf with no allergen statement as unknown, never as free of allergens', () => {
    const d = declare(layered(), 'gateau', refs);
    expect(d.unknown).toEqual([{ ingredient: 'sprinkles', name: 'Sugar sprinkles', via: [['gateau', 'sprinkles']] }]);
    expect(d.claims['egg-free'].status).toBe('fails');
    expect(d.claims['peanut-free'].status).toBe('unverified');
    expect(d.warnings.map((w) => w.code)).toContain('allergens-unknown');
  });

  it('uses the book’s regime unless told otherwise', () => {
    expect(declare(layered(), 'gateau', refs).regime).toBe('EU');
    expect(declare(layered(), 'gateau', refs, { regime: 'ANZ' }).regime).toBe('ANZ');
  });

  it('declares every recipe with sale details, and only those', () => {
    expect(declareAll(layered(), refs).declarations.map((d: Declaration) => d.product)).toEqual(['gateau']);
  });

  it('gives the weights and the portion', () => {
    expect(declare(layered(), 'gateau', refs)).toMatchObject({ finishedWeightG: 850, mixWeightG: 860, portionG: 85 });
  });

  it('refuses a book with problems and declares nothing from it', () => {
    const bad = book(
      [ing('flour')],
      [
        recipe('a', [['b', 1]], { sale: { portionG: 1 } }),
        recipe('b', [
          ['flour', 1],
          ['a', 1],
        ]),
      ],
    );
    expect(() => declare(bad, 'a', refs)).toThrow(BookProblemsError);
    try {
      declareAll(bad, refs);
      throw new Error('declareAll should refuse');
    } catch (e) {
      expect(e).toBeInstanceOf(BookProblemsError);
      expect((e as BookProblemsError).problems.map((p) => p.code)).toEqual(['recipe-cycle']);
    }
  });

  it('refuses a product that is not in the book', () => {
    expect(() => declare(layered(), 'eclair', refs)).toThrow(UnknownProductError);
  });
});
