import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { bookFileSchema, type Book, type BookFile, type SwapRequest } from '@crumbproof/shared';
import { checkBook } from './book-check';
import { siteView } from './site-view';
import { planSwap, swapAtSite, type SwapPlan } from './swap-plan';
import { book, ing, recipe } from './testing/book-builder';

// A bakery bench: butter is in the sable dough, in the croissant and greases the loaf tin.
const bench = book(
  [
    ing('flour'),
    ing('sugar'),
    ing('butter', { name: 'Butter', contains: ['milk'], vegan: false }),
    ing('plant-butter', { name: 'Plant butter' }),
    ing('almonds', { contains: ['almond'] }),
  ],
  [
    recipe('sable-dough', [
      ['flour', 200],
      ['butter', 100],
      ['sugar', 80],
    ]),
    recipe('sable', [['sable-dough', 380]], { sale: { portionG: 20, quid: ['butter'] } }),
    recipe('gift-box', [['sable', 200]], { sale: { portionG: 200 } }),
    recipe('croissant', [['flour', 300], ['butter', 150], { use: 'butter', qty: 2, unit: 'g', role: 'contact' }], {
      name: 'Croissant',
      sale: { portionG: 70, quid: ['butter', 'plant-butter'] },
    }),
    recipe('loaf', [['flour', 500], { use: 'butter', qty: 3, unit: 'g', role: 'contact' }], { sale: { portionG: 800 } }),
    recipe('macaron', [
      ['almonds', 100],
      ['sugar', 100],
    ]),
  ],
);

const planned = (req: SwapRequest): SwapPlan<Book> => {
  const result = planSwap(bench, req);
  if (!result.ok) throw new Error(`Refused: ${result.refusal.message}`);
  return result.plan;
};

describe('planSwap: the swap check before anything is saved', () => {
  it('replaces the item on every line of every recipe that uses it directly, contact lines too', () => {
    const plan = planned({ from: 'butter', to: 'plant-butter' });
    expect(plan.from).toEqual({ id: 'butter', name: 'Butter' });
    expect(plan.to).toEqual({ id: 'plant-butter', name: 'Plant butter' });
    expect(plan.changed.map((r) => r.id)).toEqual(['sable-dough', 'croissant', 'loaf']);
    const croissant = plan.changed.find((r) => r.id === 'croissant')!;
    expect(croissant.lines.map((l) => [l.use, l.qty, l.role])).toEqual([
      ['flour', 300, undefined],
      ['plant-butter', 150, undefined],
      ['plant-butter', 2, 'contact'],
    ]);
    expect(plan.after.recipes.find((r) => r.id === 'macaron')).toBe(bench.recipes.find((r) => r.id === 'macaron'));
  });

  it('names every product whose declaration can change: sold changed recipes and the sold recipes above them', () => {
    // sable-dough is not sold; sable and gift-box are above it.
    expect(planned({ from: 'butter', to: 'plant-butter' }).products).toEqual(['sable', 'gift-box', 'croissant', 'loaf']);
  });

  it('changes one recipe only when one is named, and names only the products above that one', () => {
    const plan = planned({ from: 'butter', to: 'plant-butter', recipe: 'sable-dough' });
    expect(plan.changed.map((r) => r.id)).toEqual(['sable-dough']);
    expect(plan.products).toEqual(['sable', 'gift-box']);
    expect(plan.after.recipes.find((r) => r.id === 'croissant')!.lines[1].use).toBe('butter');
  });

  it.each([
    { title: 'asks the QUID of the replacement where it was asked of the replaced item', recipe: 'croissant', quid: ['plant-butter'] },
    { title: 'keeps a QUID that named neither as it was', recipe: 'loaf', quid: undefined },
  ])('$title', ({ recipe: id, quid }) => {
    const plan = planned({ from: 'butter', to: 'plant-butter' });
    expect(plan.changed.find((r) => r.id === id)!.sale?.quid).toEqual(quid);
  });

  it('does not ask for the QUID of the same item twice when the recipe already asked for the replacement', () => {
    // croissant asks for both butter and plant butter.
    expect(planned({ from: 'butter', to: 'plant-butter', recipe: 'croissant' }).changed[0].sale!.quid).toEqual(['plant-butter']);
  });

  it('does not change the book it is given', () => {
    const before = JSON.stringify(bench);
    planned({ from: 'butter', to: 'plant-butter' });
    expect(JSON.stringify(bench)).toBe(before);
  });

  it('swaps a sub-recipe for another recipe', () => {
    const plan = planned({ from: 'sable', to: 'macaron' });
    expect(plan.changed.map((r) => [r.id, r.lines.map((l) => l.use)])).toEqual([['gift-box', ['macaron']]]);
    expect(plan.products).toEqual(['gift-box']);
  });

  it('plans a swap that would make a recipe contain itself; the book check then refuses the result', () => {
    const plan = planned({ from: 'sable-dough', to: 'gift-box' });
    expect(plan.changed.map((r) => r.id)).toEqual(['sable']);
    expect(checkBook(plan.after).map((p) => p.code)).toContain('recipe-cycle');
  });

  it.each([
    {
      req: { from: 'margarine', to: 'plant-butter' },
      refusal: {
        code: 'not-found',
        message: "There is no ingredient or recipe 'margarine' to replace.",
        fields: [{ path: 'from', message: 'Unknown id.' }],
      },
    },
    {
      req: { from: 'butter', to: 'ghee' },
      refusal: {
        code: 'not-found',
        message: "There is no ingredient or recipe 'ghee' to use instead.",
        fields: [{ path: 'to', message: 'Unknown id.' }],
      },
    },
    {
      req: { from: 'butter', to: 'butter' },
      refusal: {
        code: 'validation',
        message: 'Choose a replacement that differs from the ingredient it replaces.',
        fields: [{ path: 'to', message: 'Same as the ingredient replaced.' }],
      },
    },
    {
      req: { from: 'butter', to: 'plant-butter', recipe: 'brioche' },
      refusal: { code: 'not-found', message: "There is no recipe 'brioche'.", fields: [{ path: 'recipe', message: 'Unknown recipe.' }] },
    },
    {
      // The gift box has butter only through the sable: a swap changes the recipe whose line uses it.
      req: { from: 'butter', to: 'plant-butter', recipe: 'gift-box' },
      refusal: {
        code: 'validation',
        message: 'Butter is not used directly in Gift-box, so there is nothing to swap.',
        fields: [{ path: 'from', message: 'Not used here.' }],
      },
    },
    {
      req: { from: 'almonds', to: 'plant-butter', recipe: 'loaf' },
      refusal: {
        code: 'validation',
        message: 'Almonds is not used directly in Loaf, so there is nothing to swap.',
        fields: [{ path: 'from', message: 'Not used here.' }],
      },
    },
    {
      req: { from: 'gift-box', to: 'macaron' },
      refusal: {
        code: 'validation',
        message: 'Gift-box is not used directly in any recipe, so there is nothing to swap.',
        fields: [{ path: 'from', message: 'Not used here.' }],
      },
    },
  ])('refuses, saying "$refusal.message"', ({ req, refusal }) => {
    expect(planSwap(bench, req)).toEqual({ ok: false, refusal });
  });
});

// A chain of three kitchens over one book (tests/fixtures/chain-kitchens.book.json): the bench sells
// everything; the corner shop sells shortbread, made with its own flour; the market stall sells
// shortbread, made with its farm butter wherever the book says butter or cultured butter.
const chain: BookFile = bookFileSchema.parse(
  JSON.parse(readFileSync(join(__dirname, '..', '..', '..', '..', 'tests', 'fixtures', 'chain-kitchens.book.json'), 'utf8')),
);

/** What a swap of the whole book reaches at each kitchen, by the kitchen's id in the book. */
function atEachKitchen(req: SwapRequest) {
  const result = planSwap(chain, req);
  if (!result.ok) throw new Error(`Refused: ${result.refusal.message}`);
  const plan = result.plan;
  return {
    plan,
    sites: Object.fromEntries(
      chain.sites!.map((s) => [s.id, swapAtSite(plan, siteView(chain, s.id), siteView(plan.after, s.id))] as const),
    ),
  };
}

describe('swapAtSite: what a swap of the shared book reaches at each kitchen', () => {
  it('changes the shared recipes once, and lists each product at every kitchen that sells it', () => {
    const { plan, sites } = atEachKitchen({ from: 'butter', to: 'plant-spread' });
    expect(plan.changed.map((r) => r.id)).toEqual(['shortbread', 'sesame-snap']);
    expect(plan.after.sites).toBe(chain.sites);
    expect(sites.bench.map((p) => p.product)).toEqual(['shortbread', 'sesame-snap']);
    // The corner shop and the market stall sell shortbread only.
    expect(sites.corner.map((p) => p.product)).toEqual(['shortbread']);
    expect(sites.market.map((p) => p.product)).toEqual(['shortbread']);
  });

  it('says which lines a kitchen made with its own ingredient before and after', () => {
    const { sites } = atEachKitchen({ from: 'butter', to: 'plant-spread' });
    // The corner shop's flour stands in before and after; the market's farm butter stood in for butter, which the swap takes out.
    expect(sites.corner[0].standIns.before.map((s) => [s.replaces, s.with])).toEqual([['flour', 'corner-flour']]);
    expect(sites.corner[0].standIns.after.map((s) => [s.replaces, s.with])).toEqual([['flour', 'corner-flour']]);
    expect(sites.market[0].standIns.before.map((s) => [s.line, s.replaces, s.with])).toEqual([[2, 'butter', 'farm-butter']]);
    expect(sites.market[0].standIns.after).toEqual([]);
    expect(sites.bench[0].standIns).toEqual({ before: [], after: [] });
  });

  it('leaves out a kitchen whose own ingredient stands in for both the replaced ingredient and its replacement', () => {
    const { sites } = atEachKitchen({ from: 'butter', to: 'cultured-butter' });
    expect(sites.bench.map((p) => p.product)).toEqual(['shortbread', 'sesame-snap']);
    expect(sites.corner.map((p) => p.product)).toEqual(['shortbread']);
    // The market stall makes shortbread with its farm butter either way: nothing changes there.
    expect(sites.market).toEqual([]);
  });

  it('lists nothing at a kitchen that sells none of the products reached', () => {
    const { sites } = atEachKitchen({ from: 'sesame', to: 'sugar', recipe: 'sesame-snap' });
    expect(sites.bench.map((p) => p.product)).toEqual(['sesame-snap']);
    expect(sites.corner).toEqual([]);
    expect(sites.market).toEqual([]);
  });

  it.each([
    {
      req: { from: 'corner-flour', to: 'flour' },
      refusal: {
        code: 'validation',
        message:
          "Stone-ground wheat flour is Corner Shop's own ingredient, standing in there for Plain wheat flour; the recipes name the shared ingredients, so there is no line of it to swap. Swap Plain wheat flour, or change Corner Shop's substitution.",
        fields: [{ path: 'from', message: 'Kept only at Corner Shop.' }],
      },
    },
    {
      req: { from: 'butter', to: 'farm-butter' },
      refusal: {
        code: 'validation',
        message:
          'Farm butter is kept only at Market Stall, and the recipes are shared by every kitchen: choose a shared ingredient, or let Market Stall stand its own in by a substitution.',
        fields: [{ path: 'to', message: 'Kept only at Market Stall.' }],
      },
    },
  ])('refuses a kitchen’s own ingredient, saying "$refusal.message"', ({ req, refusal }) => {
    expect(planSwap(chain, req)).toEqual({ ok: false, refusal });
  });
});
