import { COUNTER_VERDICTS, type CounterProduct } from '@crumbproof/shared';
import { describe, expect, it } from 'vitest';
import { APPROVED, DEMO_RULES, demoCounterView, demoDeclaration, served } from '../testing/counter-view';
import { lookUp, matchesSearch, type CounterAsk, type LookupRow } from './lookup';

const view = demoCounterView(['strawberry-layer-cake', 'vegan-brownie', 'lemon-shortbread']);
const names = (rows: readonly LookupRow[]) => rows.map((r) => r.product.name);
const line = (rows: readonly LookupRow[]) => rows.map((r) => `${r.product.name}: ${r.verdict?.verdict ?? '-'}: ${r.reason}`);

describe('the counter lookup over the demo kitchen (real declarations, UK groups)', () => {
  it('with nothing picked lists the products on sale today first, each section by name, with what each contains', () => {
    const result = lookUp(view.products, view.rules, { avoid: [], want: [] });
    expect(names(result.onSale)).toEqual([
      'Chocolate-dipped lemon shortbread',
      'Dark chocolate brownie (vegan)',
      'Strawberry and vanilla layer cake',
    ]);
    expect(names(result.rest)).toEqual(['Apricot and walnut spelt loaf', 'Summer strawberry tart']);
    expect(result.onSale.every((r) => r.verdict === null)).toBe(true);
    expect(line(result.onSale)).toContain(
      'Strawberry and vanilla layer cake: -: Contains wheat, egg and milk; not known: Sugar strands has no allergen statement',
    );
    expect(line(result.onSale)).toContain('Dark chocolate brownie (vegan): -: Contains wheat');
  });

  it('for egg and sesame puts may contain before contains, and says where from and why in one sentence', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['eggs', 'sesame'], want: [] });
    expect(line(result.onSale)).toEqual([
      'Chocolate-dipped lemon shortbread: may-contain: May contain sesame: made on equipment shared with sesame',
      'Dark chocolate brownie (vegan): may-contain: May contain sesame: made on equipment shared with sesame',
      'Strawberry and vanilla layer cake: contains: Has egg in the Vanilla sponge and the Meringue buttercream',
    ]);
    expect(line(result.rest)).toEqual([
      'Apricot and walnut spelt loaf: contains: Has sesame in the Sesame seeds',
      'Summer strawberry tart: contains: Has egg in the Sweet shortcrust and the Vanilla pastry cream',
    ]);
  });

  it('for one tree nut and vegan says "as recorded", never safe, for the one product that passes', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['walnut'], want: ['vegan'] });
    const [first] = result.onSale;
    expect(first?.product.name).toBe('Dark chocolate brownie (vegan)');
    expect(first?.verdict?.verdict).toBe('suitable-as-recorded');
    expect(first?.reason).toBe('No listed walnut, no may-contain of walnut, as recorded; vegan as recorded');
    expect(line(result.rest)).toContain('Apricot and walnut spelt loaf: contains: Has walnut in the Walnut pieces');
    for (const row of [...result.onSale, ...result.rest]) expect(row.reason).not.toMatch(/\bsafe\b/i);
  });

  it('says allergens found in the same places together', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['eggs', 'milk'], want: [] });
    expect(line(result.onSale)).toContain(
      'Strawberry and vanilla layer cake: contains: Has egg and milk in the Vanilla sponge and the Meringue buttercream',
    );
  });

  it('names every supplier behind a may-contain', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['milk'], want: [] });
    expect(line(result.onSale)[0]).toBe(
      'Dark chocolate brownie (vegan): may-contain: May contain milk: the suppliers of Dairy-free dark chocolate 70% and Plant-based baking spread say so',
    );
  });

  it('says what is not known, naming the ingredient, and orders it after may contain and before contains', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['mustard'], want: [] });
    const cake = result.onSale.find((r) => r.product.id === 'strawberry-layer-cake');
    expect(cake?.verdict?.verdict).toBe('not-known');
    expect(cake?.reason).toBe('Not known: Sugar strands has no allergen statement');
    expect(result.onSale.map((r) => r.verdict?.verdict)).toEqual(['suitable-as-recorded', 'suitable-as-recorded', 'not-known']);
  });

  it('refuses a code the regime does not declare and classifies nothing', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['pine-nut'], want: [] });
    expect(result.onSale).toEqual([]);
    expect(result.rest).toEqual([]);
    expect(result.problems.join(' ')).toMatch(/pine nut is not declared under this regime/);
  });
});

describe('ordering within a section', () => {
  // Four products, one of each verdict for egg, named against the verdict order so the sort must work.
  const product = (id: string, name: string, from: string): CounterProduct => ({
    id,
    name,
    onSale: true,
    declaration: served({ ...demoDeclaration(from), product: id, name }),
    approval: APPROVED,
  });
  const products = [
    product('a', 'Almond slice', 'strawberry-tart'), // has egg: contains
    product('b', 'Bun', 'strawberry-layer-cake'), // has egg too
    product('c', 'Crumble', 'vegan-brownie'), // no egg recorded
    product('d', 'Date loaf', 'apricot-walnut-loaf'), // no egg recorded
  ];

  it.each<{ title: string; ask: CounterAsk; expected: string[] }>([
    {
      title: 'egg: suitable by name, then contains by name',
      ask: { avoid: ['eggs'], want: [] },
      expected: ['Crumble', 'Date loaf', 'Almond slice', 'Bun'],
    },
    {
      title: 'mustard: suitable, then not known (the cake has Sugar strands)',
      ask: { avoid: ['mustard'], want: [] },
      expected: ['Almond slice', 'Crumble', 'Date loaf', 'Bun'],
    },
    {
      title: 'milk: suitable, may contain, contains',
      ask: { avoid: ['milk'], want: [] },
      expected: ['Date loaf', 'Crumble', 'Almond slice', 'Bun'],
    },
    { title: 'nothing picked: by name', ask: { avoid: [], want: [] }, expected: ['Almond slice', 'Bun', 'Crumble', 'Date loaf'] },
  ])('$title', ({ ask, expected }) => {
    const result = lookUp(products, DEMO_RULES, ask);
    expect(names(result.onSale)).toEqual(expected);
    const ranks = result.onSale.map((r) => (r.verdict ? COUNTER_VERDICTS.indexOf(r.verdict.verdict) : 0));
    expect(ranks).toEqual([...ranks].sort((x, y) => x - y));
  });
});

describe('search by name', () => {
  it.each([
    ['choc brown', 'Dark chocolate brownie (vegan)', true],
    ['BROWNIE', 'Dark chocolate brownie (vegan)', true],
    ['creme', 'Crème brûlée tart', true],
    ['  lemon   short ', 'Chocolate-dipped lemon shortbread', true],
    ['walnut', 'Summer strawberry tart', false],
    ['', 'Summer strawberry tart', true],
  ])('"%s" in "%s": %s', (search, name, expected) => {
    expect(matchesSearch(name, search)).toBe(expected);
  });

  it('narrows the results and keeps the sections', () => {
    const result = lookUp(view.products, view.rules, { avoid: ['eggs'], want: [] }, 'straw');
    expect(names(result.onSale)).toEqual(['Strawberry and vanilla layer cake']);
    expect(names(result.rest)).toEqual(['Summer strawberry tart']);
  });
});
