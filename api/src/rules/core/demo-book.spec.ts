import { bookSchema } from '@crumbproof/shared';
import demo from '../../database/seeders/demo-book.json';
import { loadReferenceData } from '../reference-data';
import { checkBook } from './book-check';
import { declare, declareAll } from './declare';

/** The demo kitchen (api/src/database/seeders/demo-book.json): facts a user of the demo would rely on. */
const refs = loadReferenceData();
const book = bookSchema.parse(demo);
const of = (id: string) => declare(book, id, refs);

describe('the demo kitchen', () => {
  it('is a valid book with no problems', () => {
    expect(checkBook(book)).toEqual([]);
    expect(book.site.regime).toBe('UK');
  });

  it('declares every product for sale, each without errors', () => {
    const { declarations } = declareAll(book, refs);
    expect(declarations.map((d) => d.product)).toEqual([
      'strawberry-layer-cake',
      'strawberry-tart',
      'apricot-walnut-loaf',
      'vegan-brownie',
      'lemon-shortbread',
    ]);
    for (const d of declarations) expect(d.errors).toEqual([]);
  });

  it('nests sub-recipes at least three levels deep', () => {
    const d = of('strawberry-layer-cake');
    const meringue = d.ingredients.find((i) => i.id === 'meringue-buttercream')!.children.find((c) => c.id === 'italian-meringue')!;
    expect(meringue.children.map((c) => c.id)).toContain('egg-whites');
  });

  it('layer cake: contains eggs via its sponge and via the Italian meringue in its buttercream', () => {
    const eggs = of('strawberry-layer-cake').contains.find((c) => c.allergen === 'eggs')!;
    expect(eggs.via).toEqual(
      expect.arrayContaining([
        ['strawberry-layer-cake', 'vanilla-sponge', 'eggs'],
        ['strawberry-layer-cake', 'meringue-buttercream', 'italian-meringue', 'egg-whites'],
      ]),
    );
  });

  it('layer cake: sugar strands have no allergen statement, so free-from claims cannot be verified', () => {
    const d = of('strawberry-layer-cake');
    expect(d.unknown.map((u) => u.ingredient)).toEqual(['sugar-strands']);
    expect(d.claims['nut-free'].status).toBe('unverified');
    expect(d.claims.vegetarian.status).toBe('ok');
    // wheat glucose syrup in the meringue is exempt (assimilated Reg 1169/2011 Annex II 1(a))
    expect(d.exempt.map((e) => e.ingredient)).toEqual(['glucose-syrup']);
  });

  it('layer cake: with the sugar strands unknown its sulphites are not known, never below the threshold', () => {
    const d = of('strawberry-layer-cake');
    // Assimilated Regulation 1169/2011 Annex II point 12 declares more than 10 mg/kg; nothing recorded shows the cake is under it.
    expect(d.sulphites).toMatchObject({ status: 'not-known', mgPerKg: null, declared: false });
    expect(d.sulphites.missing).toEqual([{ ingredient: 'sugar-strands', name: 'Sugar strands', reason: 'no-allergen-statement' }]);
    expect(d.warnings.filter((w) => w.code === 'sulphites-not-known').map((w) => w.ingredient)).toEqual(['sugar-strands']);
  });

  it('vegan brownie: vegan is ok, and the declaration warns it is not dairy-free (plant spread and chocolate may contain milk)', () => {
    const d = of('vegan-brownie');
    expect(d.claims.vegan).toEqual({ status: 'ok', reasons: [] });
    expect(d.claims['dairy-free'].status).toBe('fails');
    expect(d.mayContain.find((m) => m.allergen === 'milk')!.why).toEqual([
      'Supplier of Dairy-free dark chocolate 70%: may contain milk',
      'Supplier of Plant-based baking spread: may contain milk',
    ]);
    expect(d.warnings.map((w) => w.code)).toContain('vegan-not-dairy-free');
  });

  it('lemon shortbread: nut-free holds (nuts are segregated in this kitchen) and the chocolate’s whey is caught', () => {
    const d = of('lemon-shortbread');
    expect(d.claims['nut-free']).toEqual({ status: 'ok', reasons: [] });
    expect(d.contains.find((c) => c.allergen === 'milk')!.via).toContainEqual(['lemon-shortbread', 'dark-chocolate']);
    expect(d.warnings.find((w) => w.code === 'composition-discrepancy')).toMatchObject({ ingredient: 'dark-chocolate' });
    // the kitchen shares equipment for sesame (site.handles)
    expect(d.mayContain).toEqual([{ allergen: 'sesame', label: 'sesame seeds', why: ['Sesame: shared equipment in this kitchen'] }]);
  });

  it('spelt loaf: spelt refers to wheat, sulphites from the apricots are declared, the dusting flour is listed last', () => {
    const d = of('apricot-walnut-loaf');
    expect(
      d.ingredientsMarkdown.startsWith('Ingredients: Wholegrain **spelt** flour (**wheat**), Water, Dried apricots (**sulphites**)'),
    ).toBe(true);
    // 100 g at 1800 mg/kg in 930 g as eaten: 180 mg / 0.93 kg = 193.548… mg/kg, reported at six
    // significant figures; more than 10 (Regulation (EU) No 1169/2011 Annex II point 12)
    expect(d.sulphites.mgPerKg).toBe(193.548);
    expect(d.sulphites.status).toBe('declared');
    expect(d.ingredients[d.ingredients.length - 1]).toMatchObject({ id: 'plain-flour', role: 'contact' });
    expect(d.claims.vegan.status).toBe('ok');
  });

  it('strawberry tart: the apricot glaze brings declarable sulphites', () => {
    const d = of('strawberry-tart');
    expect(d.contains.find((c) => c.allergen === 'sulphites')!.via).toEqual([['strawberry-tart', 'apricot-glaze', 'dried-apricots']]);
    expect(d.sulphites.mgPerKg).toBeGreaterThan(10);
  });

  it('gives every ingredient nutrition marked as invented demo figures', () => {
    for (const i of book.ingredients) expect(i.nutrition?.source).toBe('Crumbproof demo figures (invented)');
  });
});
