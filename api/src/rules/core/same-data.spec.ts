import { canonicalJson, canonicalJsonKept, sameData } from './same-data';
import { closureItems, closureOf } from './book-graph';
import { syntheticKitchen } from './testing/synthetic-kitchen';

describe('sameData: equal as data, whatever the order of keys', () => {
  it('finds an ingredient saved with its keys in another order unchanged', () => {
    const asImported = {
      name: 'Butter',
      contains: ['milk'],
      mayContain: [],
      vegan: false,
      vegetarian: true,
      nutrition: { fat: 82, energyKj: 3060 },
    };
    const asStored = {
      vegetarian: true,
      vegan: false,
      nutrition: { energyKj: 3060, fat: 82 },
      mayContain: [],
      contains: ['milk'],
      name: 'Butter',
    };
    expect(sameData(asImported, asStored)).toBe(true);
  });

  it.each([
    {
      title: 'nested objects in another key order',
      a: { a: 1, b: { c: [1, 2], d: { e: 'x', f: null } } },
      b: { b: { d: { f: null, e: 'x' }, c: [1, 2] }, a: 1 },
      same: true,
    },
    {
      title: 'objects inside lists in another key order',
      a: { lines: [{ use: 'flour', qty: 100, unit: 'g' }] },
      b: { lines: [{ unit: 'g', qty: 100, use: 'flour' }] },
      same: true,
    },
    {
      title: 'a key set to undefined and the key left out (JSON keeps neither)',
      a: { name: 'Salt', supplier: undefined },
      b: { name: 'Salt' },
      same: true,
    },
    {
      title: 'lines in another order (the recipe changed)',
      a: { lines: ['flour', 'butter'] },
      b: { lines: ['butter', 'flour'] },
      same: false,
    },
    {
      title: 'contains: [] (none stated) and contains left out (no statement)',
      a: { name: 'Salt', contains: [] },
      b: { name: 'Salt' },
      same: false,
    },
    { title: 'vegan: null (not known) and vegan left out', a: { vegan: null }, b: {}, same: false },
    { title: 'vegan: null (not known) and vegan: false', a: { vegan: null }, b: { vegan: false }, same: false },
    { title: 'the number 1 and the text "1"', a: { qty: 1 }, b: { qty: '1' }, same: false },
    { title: 'an empty list and an empty object', a: { quid: [] }, b: { quid: {} }, same: false },
    { title: 'one more key', a: { a: 1 }, b: { a: 1, b: 2 }, same: false },
    { title: 'a longer list', a: [1, 2], b: [1, 2, 3], same: false },
    { title: 'a key named differently with the same value', a: { gPerMl: 1.03 }, b: { gEach: 1.03 }, same: false },
    { title: 'two nulls', a: null, b: null, same: true },
    { title: 'undefined and null', a: undefined, b: null, same: false },
    { title: 'two undefineds', a: undefined, b: undefined, same: true },
    {
      title: 'a date and its ISO text (as JSON sends it)',
      a: { at: new Date('2026-03-01T10:00:00Z') },
      b: { at: '2026-03-01T10:00:00.000Z' },
      same: true,
    },
  ])('$title: $same', ({ a, b, same }) => {
    expect(sameData(a, b)).toBe(same);
    expect(sameData(b, a)).toBe(same);
  });
});

describe('canonicalJson', () => {
  it('writes keys sorted at every depth and drops undefined ones, so the same inputs hash the same', () => {
    expect(canonicalJson({ b: 1, a: { d: [{ z: 1, y: undefined, x: 2 }], c: null } })).toBe('{"a":{"c":null,"d":[{"x":2,"z":1}]},"b":1}');
  });

  it('keeps the order of lists, writing a missing entry as null as JSON does', () => {
    expect(canonicalJson([3, undefined, 1])).toBe('[3,null,1]');
  });
});

describe('canonicalJsonKept: canonicalJson with the text of parts met before kept', () => {
  it.each<[string, unknown]>([
    ['nested objects and lists', { b: 1, a: { d: [{ z: 1, y: undefined, x: 2 }], c: null } }],
    ['a missing entry and a hole in a list', Object.assign([3, undefined], { 3: 1 })],
    ['keys JSON writes first (index keys)', { b: 1, 10: 'ten', 2: 'two', a: [{ 1: true, z: false }] }],
    [
      'a date, and an object whose toJSON gives nothing',
      { at: new Date(Date.UTC(2026, 0, 2)), gone: { toJSON: () => undefined }, kept: 1 },
    ],
    ['functions and symbols, left out of objects and null in lists', { f: () => 1, s: Symbol('s'), list: [() => 1, Symbol('t')] }],
    ['odd strings and numbers', { 'a"b': 'line\nbreak \u2028 \u0000', n: [-0, 1e21, Number.NaN, Infinity, 0.1] }],
    ['plain values', 'text'],
    ['nothing', undefined],
  ])('writes %s as canonicalJson does', (_name, value) => {
    const known = new WeakMap<object, string>();
    expect(canonicalJsonKept(value, known)).toBe(canonicalJson(value));
    expect(canonicalJsonKept(value, known)).toBe(canonicalJson(value));
  });

  it('writes the inputs of every product of a book as canonicalJson does, with one store for all', () => {
    const kitchen = syntheticKitchen('small');
    const known = new WeakMap<object, string>();
    for (const r of kitchen.recipes) {
      const inputs = { slice: closureOf(kitchen, r.id), items: closureItems(kitchen, r.id), siteId: 3, regime: 'EU' };
      expect(canonicalJsonKept(inputs, known)).toBe(canonicalJson(inputs));
    }
    expect(known.has(kitchen.ingredients[0])).toBe(true);
  });
});
