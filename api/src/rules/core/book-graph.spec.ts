import { bookSchema, type Book } from '@crumbproof/shared';
import demo from '../../database/seeders/demo-book.json';
import { bookClosures, closureItems, closureOf, recipesAbove, recipesAboveAny, usedIn } from './book-graph';
import { book, ing, recipe } from './testing/book-builder';
import { syntheticKitchen } from './testing/synthetic-kitchen';

const ids = (refs: { id: string }[]) => refs.map((r) => r.id);

/** layer-0 uses layer-1, … down to the last, which uses flour. */
const chain = (depth: number) =>
  book(
    [ing('flour')],
    Array.from({ length: depth }, (_, i) => recipe(`layer-${i}`, [[i === depth - 1 ? 'flour' : `layer-${i + 1}`, 10]])),
  );

/** level-0 uses `bottom`; each level above uses a left and a right recipe that both use the level below. */
const stackedDiamonds = (levels: number, bottom: string) => {
  const recipes = [recipe('level-0', [[bottom, 10]])];
  for (let i = 1; i <= levels; i++) {
    recipes.push(recipe(`left-${i}`, [[`level-${i - 1}`, 10]]), recipe(`right-${i}`, [[`level-${i - 1}`, 10]]));
    recipes.push(
      recipe(`level-${i}`, [
        [`left-${i}`, 10],
        [`right-${i}`, 10],
      ]),
    );
  }
  return recipes;
};

describe('closureItems and closureOf: what a product is declared from', () => {
  // A layer cake: sponge and jam inside, butter both in the sponge and greasing the tin.
  const bench = book(
    [ing('flour'), ing('sugar'), ing('butter'), ing('strawberries'), ing('pectin'), ing('salt')],
    [
      recipe('sponge', [
        ['flour', 200],
        ['sugar', 150],
        ['butter', 150],
      ]),
      recipe('jam', [
        ['strawberries', 300],
        ['sugar', 200],
        ['pectin', 5],
      ]),
      recipe('layer-cake', [['sponge', 400], ['jam', 100], { use: 'butter', qty: 2, unit: 'g', role: 'contact' }]),
    ],
  );

  it('starts with the product and walks down its lines, a sub-recipe’s items straight after it', () => {
    expect(closureItems(bench, 'layer-cake')).toEqual([
      { id: 'layer-cake', kind: 'recipe' },
      { id: 'sponge', kind: 'recipe' },
      { id: 'flour', kind: 'ingredient' },
      { id: 'sugar', kind: 'ingredient' },
      { id: 'butter', kind: 'ingredient' },
      { id: 'jam', kind: 'recipe' },
      { id: 'strawberries', kind: 'ingredient' },
      { id: 'pectin', kind: 'ingredient' },
    ]);
  });

  it('keeps the site and only the items reached, in the book’s own order', () => {
    const slice = closureOf(bench, 'sponge');
    expect(slice.site).toBe(bench.site);
    expect(ids(slice.ingredients)).toEqual(['flour', 'sugar', 'butter']);
    expect(ids(slice.recipes)).toEqual(['sponge']);
  });

  it('lists an item shared by two sub-recipes once (a diamond)', () => {
    const diamond = book(
      [ing('butter'), ing('flour')],
      [
        recipe('shortcrust', [
          ['flour', 200],
          ['butter', 100],
        ]),
        recipe('tart-base', [['shortcrust', 300]]),
        recipe('tart-lid', [['shortcrust', 100]]),
        recipe('pie', [
          ['tart-base', 300],
          ['tart-lid', 100],
        ]),
      ],
    );
    expect(ids(closureItems(diamond, 'pie'))).toEqual(['pie', 'tart-base', 'shortcrust', 'flour', 'butter', 'tart-lid']);
  });

  it.each([
    {
      title: 'reaches an ingredient the product’s QUID names but no line uses',
      bench: book(
        [ing('flour'), ing('butter'), ing('almonds')],
        [recipe('biscuit', [['flour', 100]], { sale: { portionG: 20, quid: ['butter', 'almonds'] } })],
      ),
      product: 'biscuit',
      expected: ['biscuit', 'flour', 'butter', 'almonds'],
    },
    {
      title: 'reaches a sub-recipe the QUID names, with its own items',
      bench: book(
        [ing('flour'), ing('butter')],
        [recipe('shortcrust', [['butter', 50]]), recipe('tart', [['flour', 100]], { sale: { portionG: 80, quid: ['shortcrust'] } })],
      ),
      product: 'tart',
      expected: ['tart', 'flour', 'shortcrust', 'butter'],
    },
    {
      title: 'reaches an item a sold sub-recipe’s QUID names',
      bench: book(
        [ing('flour'), ing('butter'), ing('vanilla')],
        [
          recipe('sable', [['flour', 100]], { sale: { portionG: 10, quid: ['vanilla'] } }),
          recipe('gift-box', [['sable', 100]], { sale: { portionG: 100 } }),
        ],
      ),
      product: 'gift-box',
      expected: ['gift-box', 'sable', 'flour', 'vanilla'],
    },
    {
      title: 'leaves out an id the book does not hold (the book check refuses it)',
      bench: book(
        [ing('flour')],
        [
          recipe(
            'bun',
            [
              ['flour', 100],
              ['unicorn-dust', 1],
            ],
            { sale: { portionG: 60, quid: ['saffron'] } },
          ),
        ],
      ),
      product: 'bun',
      expected: ['bun', 'flour'],
    },
    {
      title: 'walks each of two recipes that use each other once (a cycle the book check refuses)',
      bench: book(
        [ing('flour')],
        [
          recipe('a', [['b', 10]]),
          recipe('b', [
            ['a', 10],
            ['flour', 5],
          ]),
        ],
      ),
      product: 'a',
      expected: ['a', 'b', 'flour'],
    },
    {
      title: 'walks a recipe that uses itself once',
      bench: book(
        [ing('flour')],
        [
          recipe('loop', [
            ['loop', 10],
            ['flour', 5],
          ]),
        ],
      ),
      product: 'loop',
      expected: ['loop', 'flour'],
    },
    { title: 'reaches nothing from an unknown product', bench: book([ing('flour')], []), product: 'nothing', expected: [] },
  ])('$title', ({ bench, product, expected }) => {
    expect(ids(closureItems(bench, product))).toEqual(expected);
  });

  it('walks a product 500 sub-recipes deep', () => {
    const depth = 500;
    const reached = closureItems(chain(depth), 'layer-0');
    expect(reached).toHaveLength(depth + 1);
    expect(reached[depth]).toEqual({ id: 'flour', kind: 'ingredient' });
  });
});

describe('bookClosures: the closures of many products of one book', () => {
  /** Every item of the book, asked for in the given order: each gives what closureItems and closureOf give. */
  const expectAlike = (kitchen: Book, ids: string[] = [...kitchen.recipes, ...kitchen.ingredients].map((x) => x.id)) => {
    const closures = bookClosures(kitchen);
    for (const id of [...ids, 'no-such-item']) {
      expect([id, closures.items(id)]).toEqual([id, closureItems(kitchen, id)]);
      expect([id, closures.of(id)]).toEqual([id, closureOf(kitchen, id)]);
    }
  };

  it.each<[string, Book]>([
    ['the demo kitchen', bookSchema.parse(demo)],
    ['the small synthetic kitchen', syntheticKitchen('small')],
  ])('gives every item of %s what walking it alone gives, products first or sub-recipes first', (_name, kitchen) => {
    const ids = kitchen.recipes.map((r) => r.id);
    expectAlike(kitchen, ids);
    expectAlike(kitchen, [...ids].reverse());
  });

  it('gives a product 500 sub-recipes deep its whole chain', () => {
    const kitchen = chain(500);
    expect(bookClosures(kitchen).items('layer-0')).toHaveLength(501);
    expectAlike(kitchen);
  });

  it('counts an item shared through stacked diamonds once', () => {
    const kitchen = book([ing('butter')], stackedDiamonds(12, 'butter'));
    expect(bookClosures(kitchen).items('level-12')).toHaveLength(3 * 12 + 2);
    expectAlike(kitchen);
  });

  it('gives what walking alone gives on 300 small kitchens with cycles, repeated ids, QUID items and ids the book does not hold', () => {
    let seed = 11;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    const pick = <T>(xs: T[]) => xs[Math.floor(next() * xs.length)];
    for (let k = 0; k < 300; k++) {
      const names = ['a', 'b', 'c', 'd', 'e', 'f', 'g'];
      const acyclic = next() < 0.5;
      const recipes = names.map((id, n) => {
        // Half the kitchens use only recipes later in the list: no cycle.
        const below = acyclic ? names.slice(n + 1) : names;
        const uses = [...below, 'flour', 'sugar', 'salt', 'unknown'].filter(() => next() < 0.3);
        const quid = next() < 0.2 ? [pick([...names, 'salt', 'nowhere'])] : undefined;
        return recipe(
          id,
          (uses.length > 0 ? uses : ['sugar']).map((u) => [u, 10] as [string, number]),
          quid ? { sale: { portionG: 10, quid } } : {},
        );
      });
      const kitchen = book([ing('flour'), ing('sugar'), ing('salt')], recipes);
      const repeated = next() < 0.2 ? { ...kitchen, ingredients: [...kitchen.ingredients, { ...ing('c'), contains: [] }] } : kitchen;
      const ids = [...names, 'flour', 'salt'].sort(() => next() - 0.5);
      expectAlike(repeated as Book, ids);
    }
  });
});

describe('usedIn: every recipe above an item, with each path', () => {
  const bench = book(
    [ing('flour'), ing('butter'), ing('sugar'), ing('salt')],
    [
      recipe('shortcrust', [
        ['flour', 200],
        ['butter', 100],
      ]),
      recipe('tart-base', [['shortcrust', 300]]),
      recipe('tart-lid', [
        ['shortcrust', 100],
        ['sugar', 5],
      ]),
      recipe('pie', [['tart-base', 300], ['tart-lid', 100], { use: 'butter', qty: 2, unit: 'g', role: 'contact' }], {
        sale: { portionG: 120 },
      }),
    ],
  );

  it('gives every path from each recipe down to the item, through both sides of a diamond', () => {
    expect(usedIn(bench, 'butter')).toEqual([
      { id: 'shortcrust', name: 'Shortcrust', forSale: false, paths: [['shortcrust', 'butter']] },
      { id: 'tart-base', name: 'Tart-base', forSale: false, paths: [['tart-base', 'shortcrust', 'butter']] },
      { id: 'tart-lid', name: 'Tart-lid', forSale: false, paths: [['tart-lid', 'shortcrust', 'butter']] },
      {
        id: 'pie',
        name: 'Pie',
        forSale: true,
        paths: [
          ['pie', 'tart-base', 'shortcrust', 'butter'],
          ['pie', 'tart-lid', 'shortcrust', 'butter'],
          ['pie', 'butter'],
        ],
      },
    ]);
  });

  it('finds where a sub-recipe is used, and nothing for an item no recipe uses', () => {
    expect(usedIn(bench, 'tart-lid').map((u) => [u.id, u.paths])).toEqual([['pie', [['pie', 'tart-lid']]]]);
    expect(usedIn(bench, 'salt')).toEqual([]);
    expect(usedIn(bench, 'pie')).toEqual([]);
  });

  it('gives one path where two lines of a recipe use the same item (a path names items, not lines)', () => {
    const twice = book(
      [ing('butter'), ing('flour')],
      [
        recipe('brioche', [
          ['butter', 100],
          ['flour', 300],
          ['butter', 50],
        ]),
      ],
    );
    expect(usedIn(twice, 'butter')[0].paths).toEqual([['brioche', 'butter']]);
  });

  it('does not count an item the QUID names but no line uses', () => {
    const named = book([ing('flour'), ing('butter')], [recipe('biscuit', [['flour', 100]], { sale: { portionG: 20, quid: ['butter'] } })]);
    expect(usedIn(named, 'butter')).toEqual([]);
  });

  it.each([
    {
      title: 'two recipes using each other above the item',
      recipes: [
        recipe('a', [['b', 10]]),
        recipe('b', [
          ['a', 10],
          ['flour', 5],
        ]),
      ],
      item: 'flour',
      expected: [
        ['a', [['a', 'b', 'flour']]],
        ['b', [['b', 'flour']]],
      ],
    },
    {
      title: 'the item itself in a cycle',
      recipes: [
        recipe('a', [['b', 10]]),
        recipe('b', [
          ['a', 10],
          ['flour', 5],
        ]),
      ],
      item: 'a',
      expected: [
        ['a', [['a', 'b', 'a']]],
        ['b', [['b', 'a']]],
      ],
    },
    {
      title: 'a recipe that uses itself',
      recipes: [
        recipe('loop', [
          ['loop', 10],
          ['flour', 5],
        ]),
      ],
      item: 'flour',
      expected: [['loop', [['loop', 'flour']]]],
    },
  ])('ends, each path passing a recipe once, with $title (a cycle the book check refuses)', ({ recipes, item, expected }) => {
    const cyclic = book([ing('flour')], recipes);
    expect(usedIn(cyclic, item).map((u) => [u.id, u.paths])).toEqual(expected);
  });

  it('walks only towards the item: 40 stacked diamonds beside it do not make 2^40 paths to follow', () => {
    const levels = 40;
    const recipes = stackedDiamonds(levels, 'flour');
    recipes.push(
      recipe('seasoned', [
        [`level-${levels}`, 100],
        ['salt', 1],
      ]),
    );
    const stacked = book([ing('flour'), ing('salt')], recipes);
    expect(usedIn(stacked, 'salt')).toEqual([{ id: 'seasoned', name: 'Seasoned', forSale: false, paths: [['seasoned', 'salt']] }]);
    expect(recipesAbove(stacked, 'level-0').size).toBe(3 * levels + 1);
  });

  it('finds the recipes above any of several items in one walk: the union of each one’s', () => {
    const recipes = stackedDiamonds(5, 'flour');
    recipes.push(recipe('salted', [['salt', 1]]), recipe('plain', [['water', 100]]));
    const kitchen = book([ing('flour'), ing('salt'), ing('water')], recipes);
    const each = new Set([...recipesAbove(kitchen, 'level-2'), ...recipesAbove(kitchen, 'salt')]);
    expect(recipesAboveAny(kitchen, ['level-2', 'salt'])).toEqual(each);
    expect(each.has('salted') && !each.has('plain') && !each.has('level-1')).toBe(true);
    expect(recipesAboveAny(kitchen, [])).toEqual(new Set());
  });

  it('counts every path through stacked diamonds: two ways through each of ten levels is 2^10 paths', () => {
    const levels = 10;
    const top = usedIn(book([ing('butter')], stackedDiamonds(levels, 'butter')), 'butter').find((u) => u.id === `level-${levels}`)!;
    expect(top.paths).toHaveLength(2 ** levels);
    expect(new Set(top.paths.map((p) => p.join(' > '))).size).toBe(2 ** levels);
    expect(top.paths.every((p) => p.length === 2 * levels + 2 && p.at(-1) === 'butter')).toBe(true);
  });

  it('gives exactly the paths that pass each recipe once, on 200 small kitchens with cycles and shared sub-recipes', () => {
    // Worked out the slow way for comparison: every path of lines from the recipe to the item.
    const slow = (recipes: { id: string; lines: { use: string }[] }[], item: string, from: string): string[] => {
      const byId = new Map(recipes.map((r) => [r.id, r]));
      const out: string[] = [];
      const walk = (path: string[]) => {
        const here = byId.get(path.at(-1)!)!;
        for (const use of new Set(here.lines.map((l) => l.use))) {
          if (use === item) out.push([...path, item].join(' > '));
          else if (byId.has(use) && !path.includes(use)) walk([...path, use]);
        }
      };
      walk([from]);
      return out.sort();
    };
    let seed = 7;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let k = 0; k < 200; k++) {
      const names = ['a', 'b', 'c', 'd', 'e', 'f'];
      const recipes = names.map((id) => {
        const uses = [...names, 'flour', 'sugar'].filter(() => next() < 0.3);
        return recipe(
          id,
          (uses.length > 0 ? uses : ['sugar']).map((u) => [u, 10] as [string, number]),
        );
      });
      const kitchen = book([ing('flour'), ing('sugar')], recipes);
      for (const item of ['flour', 'c']) {
        const fast = new Map(usedIn(kitchen, item).map((u) => [u.id, u.paths.map((p) => p.join(' > ')).sort()]));
        for (const r of names) expect([k, item, r, fast.get(r) ?? []]).toEqual([k, item, r, slow(kitchen.recipes, item, r)]);
      }
    }
  });

  it('gives a path 500 sub-recipes long', () => {
    const depth = 500;
    const top = usedIn(chain(depth), 'flour').find((u) => u.id === 'layer-0')!;
    expect(top.paths).toHaveLength(1);
    expect(top.paths[0]).toHaveLength(depth + 1);
  });
});
