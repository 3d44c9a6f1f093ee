import { isValid as gtinPackageIsValid } from 'gtin';
import { generateCheckDigit } from 'gtin/lib/common';
import {
  GS,
  caseGtinFromUnit,
  elementString,
  gs1CheckDigit,
  gs1Date,
  isCset82,
  netWeightElement,
  sscc,
  verifyGs1Key,
  type Gs1Element,
} from './gs1';

/** A small deterministic generator, so a failing payload can be found again. */
function random(seed: number): () => number {
  let s = seed;
  return () => {
    s = (s * 1103515245 + 12345) % 2147483648;
    return s / 2147483648;
  };
}

describe('GS1 check digits', () => {
  it('match GS1 General Specifications worked examples', () => {
    // GTIN-13 629104150021|3, SSCC 10614141123456789|7 and UPC-A (GTIN-12) 03600029145|2.
    expect(gs1CheckDigit('629104150021')).toBe(3);
    expect(gs1CheckDigit('10614141123456789')).toBe(7);
    expect(gs1CheckDigit('03600029145')).toBe(2);
    expect(verifyGs1Key('6291041500213', 'unit-gtin')).toBeNull();
    expect(verifyGs1Key('106141411234567897', 'sscc')).toBeNull();
    expect(verifyGs1Key('036000291452', 'unit-gtin')).toBeNull();
  });

  it('agree with the gtin package over many random payloads of every GTIN length', () => {
    const next = random(20261202);
    for (let n = 0; n < 4000; n++) {
      const length = [7, 11, 12, 13][n % 4];
      const payload = Array.from({ length }, () => Math.floor(next() * 10)).join('');
      const digit = gs1CheckDigit(payload);
      expect(String(digit)).toBe(generateCheckDigit(payload));
      expect(gtinPackageIsValid(`${payload}${digit}`)).toBe(true);
      const wrong = (digit + 1 + Math.floor(next() * 9)) % 10;
      expect(gtinPackageIsValid(`${payload}${wrong}`)).toBe(false);
      expect(verifyGs1Key(`${payload}${wrong}`, 'gtin')).toContain(`should be ${digit}, not ${wrong}`);
    }
  });

  it('say what is wrong with a key that is not one', () => {
    expect(verifyGs1Key('6291041500214', 'unit-gtin')).toBe(
      "The check digit of 6291041500214 should be 3, not 4 (GS1 modulo 10): check the number on the product's registration.",
    );
    expect(verifyGs1Key('62910415002', 'unit-gtin')).toBe("A unit's GTIN has 8, 12 or 13 digits; '62910415002' has 11.");
    expect(verifyGs1Key('6291041500213', 'gtin-14')).toBe("A case GTIN-14 has 14 digits; '6291041500213' has 13.");
    expect(verifyGs1Key('62910415O0213', 'unit-gtin')).toContain('digits only');
    expect(verifyGs1Key('', 'gtin')).toContain('digits only');
  });
});

describe('case GTIN-14 from a unit GTIN', () => {
  it('puts the indicator first, drops the unit check digit and computes a new one', () => {
    // 1 + 629104150021 → 1629104150021, check digit 0 (the added 1 weighs 3).
    expect(caseGtinFromUnit('6291041500213', 1)).toBe('16291041500210');
    expect(gtinPackageIsValid(caseGtinFromUnit('6291041500213', 1))).toBe(true);
    // A GTIN-12 and a GTIN-8 are first padded to 14 digits with zeros.
    const fromUpc = caseGtinFromUnit('036000291452', 3);
    expect(fromUpc.slice(0, 13)).toBe('3003600029145');
    expect(verifyGs1Key(fromUpc, 'gtin-14')).toBeNull();
    const fromEan8 = caseGtinFromUnit('96385074', 8);
    expect(fromEan8.slice(0, 13)).toBe('8000009638507');
    expect(verifyGs1Key(fromEan8, 'gtin-14')).toBeNull();
  });

  it('refuses an indicator outside 1 to 8 and a unit GTIN with a wrong check digit', () => {
    expect(() => caseGtinFromUnit('6291041500213', 0)).toThrow('1 to 8, not 0');
    expect(() => caseGtinFromUnit('6291041500213', 9)).toThrow('1 to 8, not 9');
    expect(() => caseGtinFromUnit('6291041500214', 1)).toThrow('should be 3, not 4');
  });
});

describe('SSCC', () => {
  it('builds the GS1 example from its extension, company prefix and serial', () => {
    expect(sscc(1, '0614141', 123456789)).toBe('106141411234567897');
  });
  it('refuses a serial that does not fit after the prefix', () => {
    expect(() => sscc(0, '061414112345', 10000)).toThrow('use 0 to 9999.');
    expect(() => sscc(10, '0614141', 1)).toThrow('0 to 9');
    expect(() => sscc(0, '12345', 1)).toThrow('6 to 12 digits');
  });
});

describe('GS1 dates and character set 82', () => {
  it('writes YYMMDD and refuses a date that does not exist', () => {
    expect(gs1Date('2026-12-06')).toBe('261206');
    expect(gs1Date('2028-02-29')).toBe('280229');
    expect(() => gs1Date('2027-02-29')).toThrow('not a date that exists');
    expect(() => gs1Date('2026-4-1')).toThrow('YYYY-MM-DD');
  });
  it('accepts the 82 characters and nothing else', () => {
    expect(isCset82(`!"%&'()*+,-./0123456789:;<=>?ABCDEFGHIJKLMNOPQRSTUVWXYZ_abcdefghijklmnopqrstuvwxyz`)).toBe(true);
    for (const c of [' ', '#', '$', '@', '[', '\\', ']', '^', '`', '{', '|', '}', '~', 'é', GS]) expect(isCset82(`A${c}`)).toBe(false);
  });
});

describe('element strings', () => {
  const unit: Gs1Element[] = [
    { ai: '01', value: '16291041500210' },
    { ai: '10', value: 'B7-26' },
    { ai: '15', value: '261206' },
  ];

  it('puts predefined-length elements first and a separator after a variable-length element that is not last', () => {
    const result = elementString(unit);
    expect(result).toEqual({
      ok: true,
      hri: '(01)16291041500210(15)261206(10)B7-26',
      data: ']C10116291041500210152612061' + '0B7-26',
      bwipText: '(01)16291041500210(15)261206(10)B7-26',
      elements: [unit[0], unit[2], unit[1]],
    });
  });

  it('ends (10) with the group separator when (37) follows it in a shipment label', () => {
    const result = elementString([
      { ai: '00', value: '106141411234567897' },
      { ai: '02', value: '16291041500210' },
      { ai: '10', value: 'B7' },
      { ai: '37', value: '24' },
      { ai: '17', value: '261206' },
    ]);
    expect(result.ok && result.data).toBe(`]C100106141411234567897021629104150021017261206` + `10B7${GS}3724`);
    expect(result.ok && result.hri).toBe('(00)106141411234567897(02)16291041500210(17)261206(10)B7(37)24');
  });

  it('enforces the pairing rules of the GS1 Barcode Syntax Dictionary', () => {
    const problems = (elements: Gs1Element[]) => {
      const result = elementString(elements);
      return result.ok ? [] : result.problems;
    };
    // (37) counts trade items in a logistic unit: with (02) and (00), never with (01).
    expect(
      problems([
        { ai: '01', value: '16291041500210' },
        { ai: '37', value: '24' },
      ]),
    ).toEqual(['AI (01) and AI (37) are never used together.', 'AI (37) is only used with (00).', 'AI (37) is only used with (02).']);
    expect(
      problems([
        { ai: '00', value: '106141411234567897' },
        { ai: '02', value: '16291041500210' },
      ]),
    ).toEqual(['AI (02) is only used with (37).']);
    expect(
      problems([
        { ai: '01', value: '16291041500210' },
        { ai: '02', value: '16291041500210' },
      ]),
    ).toContain('AI (01) and AI (02) are never used together.');
    expect(problems([{ ai: '10', value: 'B7' }])).toEqual(['AI (10) is only used with (01) or (02).']);
    expect(
      problems([
        { ai: '00', value: '106141411234567897' },
        { ai: '15', value: '261206' },
      ]),
    ).toEqual(['AI (15) is only used with (01) or (02).']);
    expect(problems([...unit, { ai: '10', value: 'C8' }])).toEqual(['AI (10) is given twice; an element string holds each AI once.']);
    expect(
      problems([
        { ai: '01', value: '16291041500210' },
        { ai: '3102', value: '001250' },
        { ai: '3103', value: '012500' },
      ]),
    ).toEqual(['Give one net weight, not (3102) and (3103).']);
    expect(problems([])).toEqual(['An element string needs at least one element.']);
  });

  it('checks each value against its AI format', () => {
    const problems = (ai: string, value: string) => {
      const result = elementString([
        { ai: '01', value: '16291041500210' },
        { ai, value },
      ]);
      return result.ok ? [] : result.problems;
    };
    expect(problems('10', 'B 7')).toEqual([expect.stringContaining("'B 7' has ' '")]);
    expect(problems('10', 'A'.repeat(21))).toEqual([expect.stringContaining('1 to 20 characters')]);
    expect(problems('10', '')).toEqual([expect.stringContaining('1 to 20 characters')]);
    expect(problems('15', '270229')).toEqual(["A best before date (15) '270229' is not a date that exists."]);
    expect(problems('17', '26126')).toEqual(["A use by date (17) is written YYMMDD, not '26126'."]);
    // DD 00 stands for the last day of the month.
    expect(problems('15', '261200')).toEqual([]);
    expect(problems('3105', '12345')).toEqual([expect.stringContaining('6 digits')]);
    expect(problems('3106', '123456')).toEqual([expect.stringContaining('(3106) is not one this product encodes')]);
    expect(elementString([{ ai: '01', value: '16291041500211' }])).toEqual({
      ok: false,
      problems: [expect.stringContaining('should be 0, not 1')],
    });
    expect(elementString([{ ai: '00', value: '10614141123456789' }])).toEqual({
      ok: false,
      problems: ["An SSCC (00) has 18 digits, not '10614141123456789'."],
    });
  });
});

describe('net weight (310n)', () => {
  it('writes kilograms with the most decimals six digits hold', () => {
    expect(netWeightElement(1250)).toEqual({ ai: '3105', value: '125000' });
    expect(netWeightElement(12500)).toEqual({ ai: '3104', value: '125000' });
    expect(netWeightElement(750.5)).toEqual({ ai: '3105', value: '075050' });
    expect(netWeightElement(1_000_000)).toEqual({ ai: '3102', value: '100000' });
    expect(netWeightElement(0.001)).toBeNull();
  });
});
