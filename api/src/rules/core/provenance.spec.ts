import { VIA_LISTED_AT_MOST, type Declaration } from '@crumbproof/shared';
import { loadReferenceData } from '../reference-data';
import { declare, declareAll } from './declare';
import { book, ing, recipe } from './testing/book-builder';
import { syntheticKitchen } from './testing/synthetic-kitchen';
import { buildTree, indexBook, leavesOf, pathKey } from './tree';

/**
 * How a declaration says where something comes from when a shared sub-recipe reaches the product
 * by many paths: each distinct path once, shortened beyond VIA_LISTED_AT_MOST to one path per place
 * (a line of the product's own recipe, in the mix and by contact apart), the rest counted. Checked
 * against the product's whole tree (buildTree), worked out apart from the declaration.
 */
const refs = loadReferenceData();
const LAYERS = 12;
const layers = Array.from({ length: LAYERS }, (_, n) => `layer-${n + 1}`);

const ingredients = [
  ing('butter', { name: 'Unsalted butter', contains: ['milk'], vegan: false }),
  ing('flour', { name: 'Plain flour', contains: ['wheat'] }),
  ing('sprinkles', { name: 'Sugar sprinkles', contains: undefined }),
  ing('sugar', { name: 'Caster sugar' }),
];
const layerRecipes = layers.map((id) =>
  recipe(id, [
    ['butter', 20],
    ['sprinkles', 2],
    ['sugar', 30],
  ]),
);

/** A stack of twelve layers under one sponge: twelve paths to the butter, all through the sponge. */
const throughOnePlace = () =>
  declare(
    book(ingredients, [
      ...layerRecipes,
      recipe(
        'sponge',
        layers.map((id) => [id, 50] as [string, number]),
      ),
      recipe('cake', [['sponge', 600], ['flour', 100], { use: 'butter', qty: 5, unit: 'g', role: 'contact' }], { sale: { portionG: 80 } }),
    ]),
    'cake',
    refs,
  );

/** The twelve layers on the product's own recipe: twelve places. */
const throughManyPlaces = () =>
  declare(
    book(ingredients, [
      ...layerRecipes,
      recipe(
        'cake',
        layers.map((id) => [id, 50] as [string, number]),
        { sale: { portionG: 80 } },
      ),
    ]),
    'cake',
    refs,
  );

describe('provenance: paths to a leaf, shortened and counted', () => {
  it('lists the first paths through one place and counts the others, never dropping one silently', () => {
    const d = throughOnePlace();
    const milk = d.contains.find((c) => c.allergen === 'milk')!;
    // Twelve paths through the sponge and one by contact (the greased tin): the contact line is a
    // place of its own, so it is listed beyond the eighth path.
    expect(milk.via).toEqual([
      ...layers.slice(0, VIA_LISTED_AT_MOST).map((layer) => ['cake', 'sponge', layer, 'butter']),
      ['cake', 'butter'],
    ]);
    expect(milk.viaMore).toBe(LAYERS - VIA_LISTED_AT_MOST);
    expect(milk.contactVia).toEqual([['cake', 'butter']]);
    expect(milk.contactViaMore).toBeUndefined();
    const unknown = d.unknown.find((u) => u.ingredient === 'sprinkles')!;
    expect(unknown.via).toHaveLength(VIA_LISTED_AT_MOST);
    expect(unknown.viaMore).toBe(LAYERS - VIA_LISTED_AT_MOST);
    // Wheat comes by one path: nothing is left out, and the count is absent.
    expect(d.contains.find((c) => c.allergen === 'gluten')).not.toHaveProperty('viaMore');
  });

  it('gives a claim reason once per leaf and place, with the count of its other paths', () => {
    const d = throughOnePlace();
    const vegan = d.claims.vegan;
    expect(vegan.status).toBe('fails');
    const inSponge = vegan.reasons.filter((r) => r.leaf === 'butter' && r.path[1] === 'sponge');
    expect(inSponge.map((r) => [r.message, r.morePaths])).toEqual([
      ['Unsalted butter is recorded as not vegan.', LAYERS - 1],
      ['Unsalted butter contains milk.', LAYERS - 1],
    ]);
    expect(inSponge[0].path).toEqual(['cake', 'sponge', 'layer-1', 'butter']);
    // The greased tin is another place, with its own words and no other path.
    const byContact = vegan.reasons.filter((r) => r.leaf === 'butter' && r.path.length === 2);
    expect(byContact.map((r) => r.message)).toEqual([
      'Unsalted butter is recorded as not vegan (through a contact line: greasing or dusting).',
      'Unsalted butter contains milk (through a contact line: greasing or dusting).',
    ]);
    expect(byContact.every((r) => r.morePaths === undefined)).toBe(true);
    const eggFree = d.claims['egg-free'];
    expect(eggFree.status).toBe('unverified');
    expect(eggFree.reasons).toEqual([
      {
        leaf: 'sprinkles',
        path: ['cake', 'sponge', 'layer-1', 'sprinkles'],
        message: 'Sugar sprinkles has no allergen statement.',
        morePaths: 11,
      },
    ]);
  });

  it('names every place of the product, however many there are', () => {
    const d = throughManyPlaces();
    const milk = d.contains.find((c) => c.allergen === 'milk')!;
    expect(milk.via).toEqual(layers.map((layer) => ['cake', layer, 'butter']));
    expect(milk).not.toHaveProperty('viaMore');
    expect(d.claims.vegan.reasons.filter((r) => r.message === 'Unsalted butter contains milk.').map((r) => r.path[1])).toEqual(layers);
  });
});

describe('provenance across the small synthetic kitchen', () => {
  const small = syntheticKitchen('small');
  const set = declareAll(small, refs);
  const index = indexBook(small);

  /**
   * Every distinct path from the product to each leaf id, from the whole tree, with its place; a
   * path by contact apart from the same ids in the mix when `contactApart` (as a claim's reasons
   * word them apart), else the first of the two.
   */
  function pathsByLeaf(product: string, contactApart = false): Map<string, Map<string, { place: string; contact: boolean }>> {
    const out = new Map<string, Map<string, { place: string; contact: boolean }>>();
    for (const leaf of leavesOf(buildTree(small, product, index).children)) {
      let paths = out.get(leaf.id);
      if (!paths) out.set(leaf.id, (paths = new Map()));
      const contact = leaf.role === 'contact';
      const key = contactApart ? `${pathKey(leaf.path)}${contact ? ' by contact' : ''}` : pathKey(leaf.path);
      if (!paths.has(key)) paths.set(key, { place: leaf.path[1], contact });
    }
    return out;
  }

  const placesOf = (paths: Iterable<{ place: string; contact: boolean }>) =>
    new Set([...paths].map((p) => `${p.place}${p.contact ? ' by contact' : ''}`));

  it('shortens paths somewhere in it (so the checks below check something)', () => {
    expect(set.declarations.some((d) => d.unknown.some((u) => (u.viaMore ?? 0) > 0))).toBe(true);
    expect(set.declarations.some((d) => Object.values(d.claims).some((c) => c.reasons.some((r) => (r.morePaths ?? 0) > 0)))).toBe(true);
  });

  it('counts, for every ingredient with no allergen statement, each distinct path once: listed or left out', () => {
    for (const d of set.declarations) {
      const byLeaf = pathsByLeaf(d.product);
      for (const u of d.unknown) {
        const paths = byLeaf.get(u.ingredient)!;
        expect(new Set(u.via.map(pathKey)).size).toBe(u.via.length);
        for (const p of u.via) expect(paths.has(pathKey(p))).toBe(true);
        expect(u.via.length + (u.viaMore ?? 0)).toBe(paths.size);
        // Every place it reaches the product through is named by a listed path.
        const listedPlaces = placesOf(u.via.map((p) => paths.get(pathKey(p))!));
        expect(listedPlaces).toEqual(placesOf(paths.values()));
        if (u.viaMore) expect(u.via.length).toBeGreaterThanOrEqual(VIA_LISTED_AT_MOST);
      }
    }
  });

  it("gives the same count through a claim's reasons: one per place, its other paths counted", () => {
    const checked = (d: Declaration) => {
      const byLeaf = pathsByLeaf(d.product, true);
      for (const u of d.unknown) {
        const reasons = d.claims['egg-free'].reasons.filter(
          (r) => r.leaf === u.ingredient && r.message.startsWith(`${u.name} has no allergen statement`),
        );
        expect(reasons.reduce((n, r) => n + 1 + (r.morePaths ?? 0), 0)).toBe(byLeaf.get(u.ingredient)!.size);
        const places = reasons.map((r) => `${r.path[1]}${r.message.includes('contact line') ? ' by contact' : ''}`);
        expect(new Set(places).size).toBe(places.length);
        expect(new Set(places)).toEqual(placesOf(byLeaf.get(u.ingredient)!.values()));
      }
    };
    for (const d of set.declarations) checked(d);
  });

  it('keeps every via list within the listed paths and one per place of the product', () => {
    for (const d of set.declarations) {
      const ownLines = small.recipes.find((r) => r.id === d.product)!.lines.length;
      for (const list of [d.contains, d.precautions, d.vague, d.unknown, d.exempt]) {
        for (const entry of list) expect(entry.via.length).toBeLessThanOrEqual(VIA_LISTED_AT_MOST + 2 * ownLines);
      }
    }
  });
});

describe('a claim the product is sold with and does not hold', () => {
  it('says each reason once in its error, however many places give it', () => {
    const d = declare(
      book(ingredients, [
        ...layerRecipes,
        recipe(
          'cake',
          layers.map((id) => [id, 50] as [string, number]),
          { sale: { portionG: 80, claims: ['vegan'] } },
        ),
      ]),
      'cake',
      refs,
    );
    const [error] = d.errors.filter((e) => e.code === 'claim-not-met');
    expect(error.message).toBe(
      'Cake is sold as vegan, but the claim fails: Unsalted butter is recorded as not vegan. Unsalted butter contains milk.',
    );
    // Twelve places give each reason; the claim lists them all.
    expect(d.claims.vegan.reasons).toHaveLength(2 * LAYERS);
  });
});
