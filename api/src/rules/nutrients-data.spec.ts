import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadNutrientTable } from './nutrients-data';

describe('loadNutrientTable', () => {
  let dir: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'crumbproof-nutrients-'));
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  const write = (content: unknown): string => {
    const file = join(dir, 'nutrients.json');
    writeFileSync(file, JSON.stringify(content));
    return file;
  };
  const row = {
    id: 'caster-sugar',
    name: 'Caster sugar',
    nutrition: { fat: 0, carbohydrate: 99.9, sugars: 99.9, source: 'from memory' },
  };

  it('loads the repository table', () => {
    expect(loadNutrientTable().rows.length).toBeGreaterThan(25);
  });

  it('accepts a valid table', () => {
    const t = loadNutrientTable(write({ crumbproofNutrients: 1, note: '', rows: [row] }));
    expect(t.rows[0].nutrition.sugars).toBe(99.9);
  });

  it.each([
    { what: 'a row without a source', rows: [{ ...row, nutrition: { fat: 0 } }] },
    { what: 'an unknown nutrient key', rows: [{ ...row, nutrition: { ...row.nutrition, starch: 3 } }] },
    { what: 'fat above 100 g', rows: [{ ...row, nutrition: { ...row.nutrition, fat: 120 } }] },
    { what: 'a duplicate id', rows: [row, row] },
    { what: 'an IFCT code the source does not name', rows: [{ ...row, ifct: 'A018' }] },
  ])('rejects $what', ({ rows }) => {
    expect(() => loadNutrientTable(write({ crumbproofNutrients: 1, note: '', rows }))).toThrow(/not a valid nutrient table/);
  });
});
