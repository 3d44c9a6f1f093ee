import type { SwapRequest } from '@crumbproof/shared';
import { checkBook } from './book-check';
import { planSwap, type SwapPlan } from './swap-plan';
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

const planned = (req: SwapRequest): SwapPlan => {
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
