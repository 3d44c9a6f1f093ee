import { loadReferenceData } from '../reference-data';
import { declare } from './declare';
import { formatPercent } from './quid';
import { book, ing, recipe } from './testing/book-builder';

const refs = loadReferenceData();

function sponge(quid: string[]) {
  // Flour, sugar, butter and egg 250 g each (1000 g), baked to 900 g; QUID after moisture loss
  // (Regulation (EU) No 1169/2011 Annex VIII point 4(a)): 100 × 250 / 900 = 27.78 % each.
  return declare(
    book(
      [ing('flour', { contains: ['wheat'] }), ing('sugar'), ing('butter', { contains: ['milk'] }), ing('egg', { contains: ['egg'] })],
      [
        recipe(
          'sponge',
          [
            ['flour', 250],
            ['sugar', 250],
            ['butter', 250],
            ['egg', 250],
          ],
          { finishedWeightG: 900, sale: { portionG: 90, quid } },
        ),
      ],
    ),
    'sponge',
    refs,
  );
}

describe('QUID (EU 1169/2011 Annex VIII 4(a))', () => {
  it('butter only → 27.78 % of the finished product, shown as 28 % (whole per cent: common practice)', () => {
    const d = sponge(['butter']);
    expect(d.quid).toEqual([{ ingredient: 'butter', name: 'Butter', percent: expect.closeTo(27.778, 3), text: 'Butter 28%' }]);
  });

  it('all four → 111.1 % in total, over 100 %, so each is "prepared with 27.8 g of … per 100 g" (Annex VIII 4(a))', () => {
    const d = sponge(['flour', 'sugar', 'butter', 'egg']);
    expect(d.quid.map((q) => q.text)).toEqual([
      'Prepared with 27.8 g of flour per 100 g',
      'Prepared with 27.8 g of sugar per 100 g',
      'Prepared with 27.8 g of butter per 100 g',
      'Prepared with 27.8 g of egg per 100 g',
    ]);
  });

  it('gives the per-100 g form when one ingredient alone exceeds 100 % (Annex VIII 4(a))', () => {
    const d = declare(
      book(
        [ing('apples'), ing('sugar')],
        [
          recipe(
            'leather',
            [
              ['apples', 1500],
              ['sugar', 100],
            ],
            { finishedWeightG: 1000, sale: { portionG: 20, quid: ['apples'] } },
          ),
        ],
      ),
      'leather',
      refs,
    );
    expect(d.quid[0]).toMatchObject({ percent: 150, text: 'Prepared with 150 g of apples per 100 g' });
  });

  it('adds every use of an ingredient, scaling sub-recipes to the amount used', () => {
    const d = declare(
      book(
        [ing('butter', { contains: ['milk'] }), ing('flour'), ing('sugar')],
        [
          recipe(
            'crumble',
            [
              ['butter', 100],
              ['flour', 100],
            ],
            { finishedWeightG: 200 },
          ),
          recipe(
            'bake',
            [
              ['crumble', 100],
              ['butter', 50],
              ['sugar', 850],
            ],
            { finishedWeightG: 1000, sale: { portionG: 100, quid: ['butter', 'crumble'] } },
          ),
        ],
      ),
      'bake',
      refs,
    );
    // butter: 50 g direct + 100/200 × 100 g in the crumble = 100 g of 1000 g
    expect(d.quid.map((q) => [q.ingredient, q.percent])).toEqual([
      ['butter', expect.closeTo(10, 9)],
      ['crumble', expect.closeTo(10, 9)],
    ]);
  });

  it('refuses a QUID for an ingredient the product does not use', () => {
    const d = declare(
      book([ing('flour'), ing('raisins')], [recipe('scone', [['flour', 100]], { sale: { portionG: 50, quid: ['raisins'] } })]),
      'scone',
      refs,
    );
    expect(d.errors).toEqual([expect.objectContaining({ code: 'quid-not-in-product', ingredient: 'raisins' })]);
  });

  it.each([
    // Rounding to whole numbers is common practice, not fixed by the Regulation (from memory).
    { percent: 27.777, text: '28%' },
    { percent: 5.4, text: '5%' },
    { percent: 0.44, text: '0.4%' },
  ])('formats $percent as $text', ({ percent, text }) => {
    expect(formatPercent(percent)).toBe(text);
  });
});
