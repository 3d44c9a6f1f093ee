import { bookFileSchema, type ProductDeclaration } from '@crumbproof/shared';
import chain from '../../database/seeders/demo-chain-book.json';
import { loadReferenceData } from '../reference-data';
import { checkBook } from './book-check';
import { declareAtSite, declareSite, siteView } from './site-view';

/**
 * The demo chain (api/src/database/seeders/demo-chain-book.json): an invented bakehouse and an
 * invented café sharing one recipe book. These are the differences a newcomer is shown, checked
 * against the engine as it declares each kitchen.
 */
const refs = loadReferenceData();
const file = bookFileSchema.parse(chain);
const BAKEHOUSE = 'wrenfield-lane';
const CAFE = 'saltmarsh-cafe';
const views = { [BAKEHOUSE]: siteView(file, BAKEHOUSE), [CAFE]: siteView(file, CAFE) };
const at = (site: keyof typeof views, product: string): ProductDeclaration => declareAtSite(views[site], product, refs);
const groups = (list: readonly { allergen: string }[]) => list.map((a) => a.allergen);

describe('the demo chain of two kitchens', () => {
  it('is a valid book of two kitchens, each without problems, with about 25 products for sale between them', () => {
    expect(file.sites!.map((s) => s.id)).toEqual([BAKEHOUSE, CAFE]);
    for (const view of Object.values(views)) expect(checkBook(view.book)).toEqual([]);
    const sold = new Set(Object.values(views).flatMap((v) => v.book.recipes.filter((r) => r.sale).map((r) => r.id)));
    expect(sold.size).toBeGreaterThanOrEqual(24);
    expect(sold.size).toBeLessThanOrEqual(30);
    // Products of their own at each kitchen, and shared ones at both.
    expect(views[CAFE].notSold).toContain('apricot-walnut-loaf');
    expect(views[BAKEHOUSE].notSold).toContain('blueberry-pancakes');
  });

  it('layer cakes nest sponges, creams and glazes at least three levels deep', () => {
    const cake = at(BAKEHOUSE, 'strawberry-layer-cake');
    const buttercream = cake.ingredients.find((i) => i.id === 'meringue-buttercream')!;
    expect(buttercream.children.find((c) => c.id === 'italian-meringue')!.children.map((c) => c.id)).toContain('egg-whites');
    expect(at(CAFE, 'chocolate-fudge-cake').ingredients.map((i) => i.id)).toEqual([
      'chocolate-sponge',
      'chocolate-ganache',
      'chocolate-glaze',
    ]);
  });

  it('the café’s plant-based pancakes fail vegan through the butter greasing the griddle, in words', () => {
    const pancakes = at(CAFE, 'blueberry-pancakes');
    expect(pancakes.claims.vegan.status).toBe('fails');
    expect(pancakes.claims.vegan.reasons.map((r) => r.message)).toContain(
      'Unsalted butter is recorded as not vegan (through a contact line: greasing or dusting).',
    );
    // Milk is in the food from the greased griddle (Regulation (EU) No 1169/2011 Article 9(1)(c)), never a may-contain.
    expect(pancakes.contains.find((c) => c.allergen === 'milk')!.contactVia).toEqual([['blueberry-pancakes', 'butter']]);
    expect(groups(pancakes.mayContain)).not.toContain('milk');
  });

  it('a shared cake may contain sesame at the bakehouse, which handles sesame on shared equipment, and not at the café, which keeps it apart', () => {
    for (const product of ['strawberry-layer-cake', 'lemon-drizzle-layer-cake', 'lemon-shortbread']) {
      const bakehouse = at(BAKEHOUSE, product);
      const cafe = at(CAFE, product);
      expect(bakehouse.mayContain.find((m) => m.allergen === 'sesame')?.why).toEqual(['Sesame: shared equipment in this kitchen']);
      expect(groups(cafe.mayContain)).not.toContain('sesame');
      expect(cafe.claims['sesame-free'].status).toBe(product === 'strawberry-layer-cake' ? 'unverified' : 'ok');
      expect(bakehouse.claims['sesame-free'].status).toBe('fails');
    }
  });

  it('a cake made from gluten-free flour in a tin dusted with wheat flour contains gluten, and its gluten-free claim fails', () => {
    const cake = at(BAKEHOUSE, 'gluten-free-almond-cake');
    expect(cake.contains.find((c) => c.allergen === 'gluten')!.contactVia).toEqual([['gluten-free-almond-cake', 'plain-flour']]);
    expect(cake.claims['gluten-free'].status).toBe('fails');
    expect(cake.claims['gluten-free'].reasons.map((r) => r.message)).toEqual([
      'Plain wheat flour contains wheat with no measured gluten figure (through a contact line: greasing or dusting).',
    ]);
  });

  it('fruit preserved with sulphites: declared above 10 mg/kg, and not below it (Regulation (EU) No 1169/2011 Annex II point 12)', () => {
    const loaf = at(BAKEHOUSE, 'apricot-walnut-loaf');
    expect(loaf.sulphites.status).toBe('declared');
    expect(groups(loaf.contains)).toContain('sulphites');
    // 60 g of glacé cherries at 100 mg/kg in an 840 g slice tray: 6 mg / 0.84 kg ≈ 7.14 mg/kg.
    const slice = at(CAFE, 'cherry-bakewell-slice');
    expect(slice.sulphites.mgPerKg).toBeCloseTo(7.14, 2);
    expect(groups(slice.contains)).not.toContain('sulphites');
  });

  it('the nut-free range holds its nut-free claim at every kitchen that sells it', () => {
    let checked = 0;
    for (const view of Object.values(views)) {
      for (const d of declareSite(view, refs).declarations) {
        const recipe = view.book.recipes.find((r) => r.id === d.product)!;
        if (!recipe.sale?.claims?.includes('nut-free')) continue;
        expect([d.product, d.claims['nut-free'].status]).toEqual([d.product, 'ok']);
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(8);
  });

  it('one product has an ingredient whose allergen statement is not known yet, so its free-from claims cannot be verified', () => {
    for (const site of [BAKEHOUSE, CAFE] as const) {
      const cake = at(site, 'strawberry-layer-cake');
      expect(cake.unknown.map((u) => u.ingredient)).toEqual(['sugar-strands']);
      expect(cake.claims['nut-free'].status).toBe('unverified');
    }
  });

  it('the café stands its own flour in for the shared one, so its brownie may contain soya and the bakehouse’s does not', () => {
    const cafe = declareAtSite(views[CAFE], 'vegan-brownie', refs);
    expect('standIns' in cafe && cafe.standIns.map((s) => [s.replaces, s.with])).toEqual([['plain-flour', 'harbour-flour']]);
    expect(cafe.mayContain.find((m) => m.allergen === 'soybeans')?.why).toEqual([
      'Supplier of Stone-ground plain flour (Saltmarsh Mill): may contain soy',
    ]);
    expect(groups(at(BAKEHOUSE, 'vegan-brownie').mayContain)).not.toContain('soybeans');
    expect(at(CAFE, 'vegan-brownie').claims.vegan.status).toBe('ok');
  });
});
