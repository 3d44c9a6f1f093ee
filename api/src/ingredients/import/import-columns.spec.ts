import { closest, mapHeader, normaliseHeader, parseSources, rowToCandidate } from './import-columns';

describe('import columns', () => {
  describe('allergen sources in a cell', () => {
    it.each([
      ['wheat; milk', ['wheat', 'milk']],
      ['Wheat, Milk , wheat', ['wheat', 'milk']],
      ['Brazil nuts; pine nut; soya; sulfites; eggs; hazelnuts', ['brazil-nut', 'pine-nut', 'soy', 'sulphites', 'egg', 'hazelnut']],
      ['khorasan wheat', ['khorasan']],
      ['none', []],
      ['NONE', []],
      [
        'wheat (glucose syrup); fish (cod)',
        [
          { source: 'wheat', form: 'glucose-syrup' },
          { source: 'fish', species: 'cod' },
        ],
      ],
      ['milk (lactitol)', [{ source: 'milk', form: 'lactitol' }]],
    ])('%s', (text, entries) => {
      expect(parseSources(text)).toEqual({ entries, problems: [] });
    });

    it('reads an empty cell as no statement (unknown), not as none', () => {
      expect(parseSources('  ')).toEqual({ problems: [] });
      expect(parseSources('  ').entries).toBeUndefined();
    });

    it('names each token that is not a source, suggesting the nearest', () => {
      expect(parseSources('hazlenut; wallnut; milk').problems).toEqual([
        "'hazlenut' is not an allergen source; did you mean 'hazelnut'?",
        "'wallnut' is not an allergen source; did you mean 'walnut'?",
      ]);
      expect(parseSources('gluten').problems[0]).toMatch(/^'gluten' is not an allergen source; name the cereal instead \(wheat, rye/);
      expect(parseSources('nuts').problems[0]).toMatch(/name each nut instead/);
      expect(parseSources('chocolate').problems[0]).toMatch(/^'chocolate' is not an allergen source\. The sources are: wheat, /);
    });

    it("refuses 'none' beside sources, and an unknown bracketed form", () => {
      expect(parseSources('none; milk').problems).toEqual([
        "'none' cannot be listed with allergen sources; write 'none' alone, or only the sources.",
      ]);
      expect(parseSources('wheat (toasted)').problems[0]).toMatch(
        /^'toasted' in 'wheat \(toasted\)' is not an exempt form; the forms are: glucose-syrup/,
      );
    });
  });

  it('matches headers without regard to case, spaces, underscores, hyphens or brackets', () => {
    expect(normaliseHeader('  Supplier_Code ')).toBe('supplier code');
    const { columns, problems } = mapHeader(['ID', 'Name', 'May-Contain', 'Sulphites (mg/kg)', 'Fat (g/100 g)', 'FIBER', null]);
    expect(problems).toEqual([]);
    expect([...columns.values()].map((c) => c.field)).toEqual([
      'id',
      'name',
      'mayContain',
      'sulphiteMgPerKg',
      'nutrition.fat',
      'nutrition.fibre',
    ]);
  });

  it('names unknown, repeated and missing columns', () => {
    expect(mapHeader(['name', 'contians', 'fat', 'Fat g']).problems).toEqual([
      expect.stringMatching(/^The column 'contians' is not one this import understands; did you mean 'contains'\?/),
      "The columns 'fat' and 'Fat g' are both 'fat'; keep one.",
      "The header row has no 'id' column; every ingredient needs one.",
    ]);
  });

  it('replaces the fields the file has columns for and keeps the others', () => {
    const header = mapHeader(['id', 'name', 'contains', 'fat', 'vegan']);
    const base = {
      id: 'butter',
      name: 'Butter',
      contains: ['milk' as const],
      mayContain: [],
      vegan: false,
      vegetarian: true,
      gPerMl: 0.91,
      nutrition: { fat: 82, salt: 0.02 },
    };
    expect(rowToCandidate(['butter', 'Salted butter', '', '81', 'no'], header, base, 2)).toEqual({
      candidate: {
        id: 'butter',
        name: 'Salted butter',
        mayContain: [],
        vegan: false,
        vegetarian: true,
        gPerMl: 0.91,
        nutrition: { fat: 81, salt: 0.02 },
      },
      problems: [],
    });
    expect(rowToCandidate(['rose-water', 'Rose water', 'none', '', ''], header, undefined, 3)).toEqual({
      candidate: { id: 'rose-water', name: 'Rose water', contains: [], vegan: null, vegetarian: null },
      problems: [],
    });
  });

  it('reads yes/no cells and numbers with a decimal comma, and names each bad value by row and column as the file heads it', () => {
    const header = mapHeader(['id', 'name', 'Vegan', 'vegetarian', 'Salt', 'g each']);
    expect(rowToCandidate(['x', 'X', 'Y', true, '0,25', 60], header, undefined, 2).candidate).toMatchObject({
      vegan: true,
      vegetarian: true,
      gEach: 60,
      nutrition: { salt: 0.25 },
    });
    expect(rowToCandidate(['x', 'X', 'perhaps', 'unknown', '<0.5', 'six'], header, undefined, 4).problems).toEqual([
      "row 4, column Vegan: 'perhaps' is not yes, no or unknown.",
      "row 4, column Salt: '<0.5' is not a number.",
      "row 4, column g each: 'six' is not a number.",
    ]);
  });

  it('suggests only a clear nearest word', () => {
    expect(closest('mlik', ['milk', 'mustard'])).toBe('milk');
    expect(closest('xyz', ['milk'])).toBeUndefined();
  });
});
