import { bookRecipeSchema } from './book';
import {
  DEFAULT_BATCH_PATTERN,
  batchPatternProblem,
  expandBatchPattern,
  labelRunRequestSchema,
  labelSettingsSchema,
} from './label-contracts';

const messages = (result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  result.success ? [] : result.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);

describe('print details of a product for sale', () => {
  const recipe = (sale: Record<string, unknown>) =>
    bookRecipeSchema.safeParse({
      id: 'tart',
      name: 'Tart',
      lines: [{ use: 'flour', qty: 100, unit: 'g' }],
      sale: { portionG: 80, ...sale },
    });

  it('reads a sale without print details as before', () => {
    expect(recipe({}).success).toBe(true);
  });

  it('reads every print detail', () => {
    const parsed = recipe({
      shelfLifeDays: 4,
      dateMark: 'use-by',
      gtin: '6291041500213',
      caseGtin: '16291041500210',
      unitsPerCase: 12,
      netWeightG: 85,
      storage: 'Keep refrigerated at 0–5 °C',
    });
    expect(messages(parsed)).toEqual([]);
  });

  it('refuses a GTIN with a wrong check digit, naming the expected digit', () => {
    expect(messages(recipe({ gtin: '6291041500214' }))).toEqual([
      "sale.gtin: The check digit of 6291041500214 should be 3, not 4 (GS1 modulo 10): check the number on the product's registration.",
    ]);
    expect(messages(recipe({ caseGtin: '6291041500213' }))).toEqual([
      "sale.caseGtin: A case GTIN-14 has 14 digits; '6291041500213' has 13.",
    ]);
  });

  it('needs the shelf life and the date mark together', () => {
    expect(messages(recipe({ shelfLifeDays: 3 }))).toEqual([expect.stringMatching(/^sale\.dateMark: Say whether/)]);
    expect(messages(recipe({ dateMark: 'best-before' }))).toEqual(['sale.shelfLifeDays: Give the shelf life in days for the date mark.']);
  });

  it('refuses out-of-range numbers and a storage line with a line break', () => {
    expect(messages(recipe({ shelfLifeDays: 0, dateMark: 'use-by' }))).toEqual([
      'sale.shelfLifeDays: Give a shelf life of at least 1 day.',
    ]);
    expect(messages(recipe({ unitsPerCase: 2.5 }))).toEqual(['sale.unitsPerCase: Give the units per case as a whole number.']);
    expect(messages(recipe({ netWeightG: 0 }))).toEqual(['sale.netWeightG: Give a net weight above zero.']);
    expect(messages(recipe({ storage: 'Keep cool\nand dry' }))).toEqual([
      expect.stringMatching(/^sale\.storage: Leave out control characters/),
    ]);
  });
});

describe('a label run request', () => {
  const request = (over: Record<string, unknown>) =>
    labelRunRequestSchema.safeParse({
      template: 'product',
      items: [{ product: 'tart', quantity: 10 }],
      productionDate: '2026-12-02',
      ...over,
    });

  it('accepts a run', () => {
    expect(messages(request({ batch: '261202-TART-1' }))).toEqual([]);
  });

  it('refuses a count of zero, a date that does not exist and a batch outside character set 82', () => {
    expect(messages(request({ items: [{ product: 'tart', quantity: 0 }] }))).toEqual(['items.0.quantity: Print at least 1 label.']);
    expect(messages(request({ productionDate: '2026-02-30' }))).toEqual([
      'productionDate: 2026-02-30 is not a date that exists; check the day and month.',
    ]);
    expect(messages(request({ productionDate: '2/12/2026' }))).toEqual(['productionDate: Write the date as YYYY-MM-DD.']);
    expect(messages(request({ batch: 'LOT 7#' }))).toEqual([
      expect.stringMatching(/^batch: A batch code uses only GS1's character set 82 .*'LOT 7#' has a space, '#'\.$/),
    ]);
    expect(messages(request({ batch: 'A'.repeat(21) }))).toEqual([
      expect.stringMatching(/^batch: Use a batch code of at most 20 characters/),
    ]);
    expect(messages(request({ items: [] }))).toEqual(['items: Pick at least one product to print.']);
    expect(messages(request({ override: { reason: 'typo' } }))).toEqual([
      expect.stringMatching(/^override\.reason: Say in at least 10 characters/),
    ]);
  });

  it('refuses the same product twice', () => {
    expect(
      messages(
        request({
          items: [
            { product: 'tart', quantity: 1 },
            { product: 'tart', quantity: 2 },
          ],
        }),
      ),
    ).toEqual(['items: List each product once, with the number of labels it needs.']);
  });
});

describe('batch patterns', () => {
  it('expand each token', () => {
    expect(expandBatchPattern(DEFAULT_BATCH_PATTERN, { date: '2026-12-02', product: 'lemon-tart', sequence: 3 })).toBe('261202-LEMONT-3');
    expect(expandBatchPattern('{YYYY}{JJJ}/{P}/{NNN}', { date: '2028-12-31', product: 'eclair', sequence: 12 })).toBe('2028366/ECLAIR/012');
    expect(expandBatchPattern('{JJJ}{NN}', { date: '2026-01-01', product: 'x', sequence: 1 })).toBe('00101');
  });

  it('refuse a pattern that cannot give unique GS1 batch codes', () => {
    expect(batchPatternProblem(DEFAULT_BATCH_PATTERN)).toBeNull();
    expect(batchPatternProblem('{YY}{MM}{DD}-{P}')).toMatch(/^Put a sequence token/);
    expect(batchPatternProblem('{P}-{N}')).toMatch(/^Put the day/);
    expect(batchPatternProblem('{YY}{MM}{DD} {N}')).toMatch(/has a space/);
    expect(batchPatternProblem('{YYYY}{MM}{DD}-{P}-{NNN}-KITCHEN')).toMatch(
      /^The batch pattern gives codes such as '20261231-WWWWWW-999-KITCHEN': Use a batch code of at most 20/,
    );
    expect(batchPatternProblem('{YY}{MM}{DD}{Q}{N}')).toMatch(/^Unknown token \{Q\}/);
  });

  it('give the settings their defaults', () => {
    expect(labelSettingsSchema.parse({})).toEqual({
      batchPattern: DEFAULT_BATCH_PATTERN,
      gs1CompanyPrefix: null,
      ssccExtension: 0,
      caseIndicator: 1,
    });
    expect(messages(labelSettingsSchema.safeParse({ gs1CompanyPrefix: '12345', caseIndicator: 9 }))).toEqual([
      'gs1CompanyPrefix: A GS1 company prefix has 6 to 12 digits.',
      'caseIndicator: Give the case indicator digit, 1 to 8.',
    ]);
  });
});
