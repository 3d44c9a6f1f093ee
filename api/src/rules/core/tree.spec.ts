import { book, ing, recipe } from './testing/book-builder';
import { buildTree, leavesOf } from './tree';

describe('buildTree', () => {
  const b = book(
    [ing('flour'), ing('sugar'), ing('eggs', { gEach: 50 }), ing('milk', { gPerMl: 1.03 }), ing('oil')],
    [
      // sponge: 400 g raw, baked to 320 g
      recipe('sponge', [['flour', 200], ['sugar', 100], { use: 'eggs', qty: 2, unit: 'each' }], { finishedWeightG: 320 }),
      recipe(
        'cake',
        [['sponge', 160], { use: 'milk', qty: 100, unit: 'ml' }, ['sugar', 37], { use: 'oil', qty: 1, unit: 'tsp', role: 'contact' }],
        { finishedWeightG: 280 },
      ),
    ],
  );
  const tree = buildTree(b, 'cake');

  it('weighs lines with the kitchen measures and sums the mix', () => {
    // 100 ml × 1.03 g/ml (common practice for milk density, from memory)
    expect(tree.mixG).toBeCloseTo(160 + 103 + 37, 9);
    expect(tree.finishedG).toBe(280);
  });

  it('scales a sub-recipe by the amount used over its finished batch weight', () => {
    const sponge = tree.children[0];
    expect(sponge.usedG).toBe(160);
    // 160 g of a 320 g baked batch = half the raw lines
    const flour = sponge.children.find((c) => c.id === 'flour')!;
    expect(flour.massG).toBeCloseTo(100, 9);
    expect(flour.path).toEqual(['cake', 'sponge', 'flour']);
  });

  it('splits a sub-recipe share among its lines so siblings add up to the parent', () => {
    const sponge = tree.children[0];
    const sum = sponge.children.reduce((s, c) => s + c.share, 0);
    expect(sum).toBeCloseTo(sponge.share, 12);
    expect(sponge.share).toBeCloseTo(160 / 300, 12);
  });

  it('gives contact lines no weight', () => {
    const oil = tree.children.find((c) => c.id === 'oil')!;
    expect(oil).toMatchObject({ role: 'contact', usedG: 0, massG: 0, share: 0 });
  });

  it('merges lines that use the same id in one recipe', () => {
    const t = buildTree(book([ing('flour')], [recipe('loaf', [['flour', 300], { use: 'flour', qty: 0.2, unit: 'kg' }])]), 'loaf');
    expect(t.children).toHaveLength(1);
    expect(t.children[0].usedG).toBe(500);
  });

  it('lists every leaf with its path', () => {
    expect(leavesOf(tree.children).map((l) => l.path.join('/'))).toEqual([
      'cake/sponge/flour',
      'cake/sponge/sugar',
      'cake/sponge/eggs',
      'cake/milk',
      'cake/sugar',
      'cake/oil',
    ]);
  });
});
