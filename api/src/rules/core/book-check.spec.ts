import { checkBook } from './book-check';
import { book, ing, recipe } from './testing/book-builder';

describe('checkBook', () => {
  it('finds nothing wrong in a sound book', () => {
    const b = book(
      [ing('flour'), ing('milk', { gPerMl: 1.03 })],
      [recipe('dough', [['flour', 500], { use: 'milk', qty: 300, unit: 'ml' }])],
    );
    expect(checkBook(b)).toEqual([]);
  });

  it.each([
    {
      title: 'a recipe that uses itself',
      recipes: [
        recipe('a', [
          ['flour', 1],
          ['a', 1],
        ]),
      ],
      path: 'A contains itself: A → A.',
      ids: ['a'],
    },
    {
      title: 'two recipes that use each other',
      recipes: [
        recipe('a', [['b', 1]]),
        recipe('b', [
          ['flour', 1],
          ['a', 1],
        ]),
      ],
      path: 'A contains itself: A → B → A.',
      ids: ['a', 'b'],
    },
    {
      title: 'a cycle three levels deep',
      recipes: [
        recipe('a', [['b', 1]]),
        recipe('b', [['c', 1]]),
        recipe('c', [
          ['flour', 1],
          ['a', 1],
        ]),
      ],
      path: 'A contains itself: A → B → C → A.',
      ids: ['a', 'b', 'c'],
    },
  ])('refuses $title, naming the cycle by recipe names and its ids in order (common practice)', ({ recipes, path, ids }) => {
    const problems = checkBook(book([ing('flour')], recipes));
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ code: 'recipe-cycle', recipes: ids });
    expect(problems[0].message).toContain(path);
  });

  it('names the recipe, the line and the id of an unknown reference', () => {
    const problems = checkBook(
      book(
        [ing('flour')],
        [
          recipe(
            'tart',
            [
              ['flour', 100],
              ['flour', 5],
              ['lemmon', 2],
            ],
            { name: 'Lemon tart' },
          ),
        ],
      ),
    );
    expect(problems).toEqual([
      {
        code: 'unknown-reference',
        recipe: 'tart',
        field: 'use',
        line: 3,
        use: 'lemmon',
        message: "Line 3 of Lemon tart uses 'lemmon', which is neither an ingredient nor a recipe in this book.",
      },
    ]);
  });

  it('refuses a QUID for an id the book does not have', () => {
    const problems = checkBook(book([ing('flour')], [recipe('loaf', [['flour', 100]], { sale: { portionG: 50, quid: ['rasins'] } })]));
    expect(problems).toEqual([expect.objectContaining({ code: 'unknown-reference', recipe: 'loaf', field: 'sale.quid', use: 'rasins' })]);
    expect(problems[0].message).toContain("'rasins'");
  });

  it('says which figure is missing for a line in each, and what to do about it', () => {
    const b = book(
      [ing('sugar'), ing('butter'), ing('eggs', { gEach: 50 }), ing('lemon')],
      [
        recipe('curd', [['sugar', 100], ['butter', 80], { use: 'eggs', qty: 3, unit: 'each' }, { use: 'lemon', qty: 2, unit: 'each' }], {
          name: 'Lemon curd',
        }),
      ],
    );
    expect(checkBook(b)).toEqual([
      {
        code: 'unweighable-line',
        recipe: 'curd',
        field: 'unit',
        line: 4,
        use: 'lemon',
        unit: 'each',
        needs: 'gEach',
        message:
          "Line 4 of Lemon curd uses 'lemon' in 'each', but Lemon has no weight per unit. Add the weight of one lemon, or write the line in grams.",
      },
    ]);
  });

  it.each([
    { unit: 'ml' as const, needs: 'no weight per millilitre' },
    { unit: 'tbsp' as const, needs: 'no weight per millilitre' },
    { unit: 'cup' as const, needs: 'no weight per millilitre' },
  ])('refuses a line in $unit without a density', ({ unit, needs }) => {
    const problems = checkBook(book([ing('oil')], [recipe('dressing', [{ use: 'oil', qty: 2, unit }])]));
    expect(problems).toEqual([expect.objectContaining({ code: 'unweighable-line', line: 1, use: 'oil', unit, needs: 'gPerMl' })]);
    expect(problems[0].message).toContain(needs);
  });

  it.each([{ unit: 'each' as const }, { unit: 'ml' as const }, { unit: 'cup' as const }])(
    'refuses a sub-recipe used in $unit (recipes are weighed)',
    ({ unit }) => {
      const b = book([ing('flour')], [recipe('sponge', [['flour', 100]]), recipe('cake', [{ use: 'sponge', qty: 1, unit }])]);
      expect(checkBook(b)).toEqual([
        expect.objectContaining({ code: 'unweighable-line', recipe: 'cake', line: 1, use: 'sponge', needs: 'grams' }),
      ]);
    },
  );

  it('does not weigh contact lines (they carry no weight)', () => {
    const b = book([ing('flour'), ing('oil')], [recipe('tin', [['flour', 100], { use: 'oil', qty: 1, unit: 'tsp', role: 'contact' }])]);
    expect(checkBook(b)).toEqual([]);
  });

  it.each([
    { title: 'two ingredients', ingredients: [ing('sugar'), ing('sugar', { name: 'Caster sugar' })], recipes: [] },
    { title: 'an ingredient and a recipe', ingredients: [ing('sponge')], recipes: [recipe('sponge', [['sponge', 1]])] },
  ])('refuses an id shared by $title', ({ ingredients, recipes }) => {
    const problems = checkBook(book(ingredients, recipes));
    expect(problems).toContainEqual(expect.objectContaining({ code: 'duplicate-id', id: ingredients[0].id }));
  });
});
