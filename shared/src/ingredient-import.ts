import type { BookIngredient } from './book';

/**
 * The spreadsheet import of ingredients: `POST /api/ingredients/import/preview` answers an
 * `ImportPreview` (nothing saved), `POST /api/ingredients/import` an `ImportResult` (all rows or
 * none).
 */

/** A column the import understands, as documented in every preview. */
export interface ImportColumn {
  /** The header to use; matched case-insensitively, also under its other names. */
  header: string;
  /** Other headers accepted for the column. */
  aliases: string[];
  /** The ingredient field it fills: 'contains', 'nutrition.fat', … */
  field: string;
  required: boolean;
  description: string;
}

export type ImportAction = 'create' | 'update' | 'unchanged';

export interface ImportRow {
  /** 1-based row number as the spreadsheet program shows it (the header is row 1). */
  row: number;
  /** The row's id and name cells as written, to name the row even when its other cells cannot be read. */
  idCell: string;
  nameCell: string;
  /** The ingredient the row would become; null when its cells do not make a valid ingredient. */
  ingredient: BookIngredient | null;
  action: ImportAction;
  /** Each names the row, the column and the value: "row 4, column Contains: 'hazlenut' is not…". */
  problems: string[];
  /** The ingredient the row was compared against; null when the row has no id. */
  base: ImportRowBase | null;
}

/** The state of a row's ingredient when the preview compared the row against it. */
export interface ImportRowBase {
  /** Its current revision then; null when no ingredient had the row's id. */
  revision: number | null;
  /** A token of that state: the import is refused when it no longer matches (someone saved or created the ingredient since). */
  token: string;
}

/** Rows by what the import does with them: create, update and unchanged count only rows without problems, which alone can be imported. */
export interface ImportCounts {
  create: number;
  update: number;
  unchanged: number;
  withProblems: number;
}

export interface ImportPreview {
  format: 'csv' | 'xlsx';
  columns: ImportColumn[];
  /** How the file is read: what an empty cell, 'none' and an absent column mean. */
  rules: string[];
  /** Problems with the file as a whole (unknown or missing columns, no rows, …). */
  problems: string[];
  rows: ImportRow[];
  summary: ImportCounts;
  /**
   * Every row's token, as the import takes it back in its form field `basis` (a JSON object from
   * row number to token): the import saves nothing when any row's ingredient changed since.
   */
  basis: string;
}

/** The summary of what was imported, and each ingredient written. */
export interface ImportResult extends ImportCounts {
  /** Every ingredient written, with its new revision; unchanged rows are not written. */
  written: { id: string; revision: number }[];
}

type NutrientKey = 'energyKj' | 'energyKcal' | 'fat' | 'saturates' | 'carbohydrate' | 'sugars' | 'fibre' | 'protein' | 'salt';
export type ImportColumnKind = 'text' | 'sources' | 'diet' | 'number';

/** A column with the kind of value it holds, as the import reads it. */
export interface ImportColumnDef extends ImportColumn {
  kind: ImportColumnKind;
}

const NUTRIENT_NAMES: Record<NutrientKey, { header: string; more: string[]; unit: string }> = {
  energyKj: { header: 'energy kj', more: ['kj', 'energy (kj)'], unit: 'kJ' },
  energyKcal: { header: 'energy kcal', more: ['kcal', 'calories', 'energy (kcal)'], unit: 'kcal' },
  fat: { header: 'fat', more: ['total fat'], unit: 'g' },
  saturates: { header: 'saturates', more: ['saturated fat', 'saturated', 'sat fat'], unit: 'g' },
  carbohydrate: { header: 'carbohydrate', more: ['carbohydrates', 'carbs'], unit: 'g' },
  sugars: { header: 'sugars', more: ['sugar'], unit: 'g' },
  fibre: { header: 'fibre', more: ['fiber'], unit: 'g' },
  protein: { header: 'protein', more: [], unit: 'g' },
  salt: { header: 'salt', more: [], unit: 'g' },
};

const SOURCES_HELP =
  "Allergen sources separated by ';' or ',' (e.g. 'wheat; milk'). A source may name an exempt form or a species in brackets: 'wheat (glucose-syrup)', 'fish (cod)'.";

/** Every column the import reads, in the order the template lays them out: the one list the import, the template and the import page use. */
export const IMPORT_COLUMN_DEFS: ImportColumnDef[] = [
  {
    header: 'id',
    aliases: ['code', 'ingredient id'],
    field: 'id',
    kind: 'text',
    required: true,
    description: "The ingredient's id, used in recipe lines. A row whose id exists already becomes a new revision of that ingredient.",
  },
  {
    header: 'name',
    aliases: ['ingredient', 'ingredient name'],
    field: 'name',
    kind: 'text',
    required: true,
    description: 'The name shown on declarations.',
  },
  { header: 'supplier', aliases: [], field: 'supplier', kind: 'text', required: false, description: 'Who supplies it.' },
  {
    header: 'supplier code',
    aliases: ['supplier ref', 'product code'],
    field: 'supplierCode',
    kind: 'text',
    required: false,
    description: "The supplier's product code.",
  },
  {
    header: 'contains',
    aliases: ['allergens'],
    field: 'contains',
    kind: 'sources',
    required: false,
    description: `${SOURCES_HELP} 'none' means the supplier states it contains no allergens (verified none); an EMPTY cell means there is no allergen statement yet (unknown), which declarations treat as unverified.`,
  },
  {
    header: 'may contain',
    aliases: ['may contains', 'traces'],
    field: 'mayContain',
    kind: 'sources',
    required: false,
    description: `The supplier's precautionary statement. ${SOURCES_HELP} 'none' or an empty cell: no precautionary statement.`,
  },
  {
    header: 'composition',
    aliases: ['ingredients', 'ingredient list'],
    field: 'composition',
    kind: 'text',
    required: false,
    description: "The supplier's ingredient list.",
  },
  {
    header: 'vegan',
    aliases: [],
    field: 'vegan',
    kind: 'diet',
    required: false,
    description: 'yes, no or unknown (an empty cell is unknown).',
  },
  {
    header: 'vegetarian',
    aliases: [],
    field: 'vegetarian',
    kind: 'diet',
    required: false,
    description: 'yes, no or unknown (an empty cell is unknown).',
  },
  {
    header: 'sulphites mg/kg',
    aliases: ['sulphites', 'sulfites mg/kg', 'sulfites', 'so2 mg/kg'],
    field: 'sulphiteMgPerKg',
    kind: 'number',
    required: false,
    description: 'Sulphites (as SO2) in mg per kg, when the supplier states it.',
  },
  {
    header: 'gluten mg/kg',
    aliases: ['gluten'],
    field: 'glutenMgPerKg',
    kind: 'number',
    required: false,
    description: 'Gluten measured or specified by the supplier, mg per kg.',
  },
  {
    header: 'g per ml',
    aliases: ['g/ml', 'density', 'density g/ml'],
    field: 'gPerMl',
    kind: 'number',
    required: false,
    description: 'Grams per millilitre, to weigh recipe lines given in ml, l, tsp, tbsp or cups.',
  },
  {
    header: 'g each',
    aliases: ['weight each', 'each g'],
    field: 'gEach',
    kind: 'number',
    required: false,
    description: "Grams of one piece, to weigh recipe lines given as 'each'.",
  },
  ...(Object.entries(NUTRIENT_NAMES) as [NutrientKey, (typeof NUTRIENT_NAMES)[NutrientKey]][]).map(([key, n]) => ({
    header: n.header,
    aliases: [...n.more, ...[n.header, ...n.more].flatMap((h) => nutrientVariants(h, n.unit))],
    field: `nutrition.${key}`,
    kind: 'number' as const,
    required: false,
    description:
      key === 'energyKj' || key === 'energyKcal'
        ? `Energy per 100 g, in ${n.unit}.`
        : `${n.unit === 'g' ? 'Grams' : n.unit} of ${n.header} per 100 g.`,
  })),
];

function nutrientVariants(h: string, unit: string): string[] {
  const u = unit.toLowerCase();
  return [`${h} ${u}`, `${h} ${u}/100g`, `${h} ${u}/100 g`, `${h} per 100 g`, `${h} per 100g`, `${h} ${u} per 100 g`, `${h} ${u} per 100g`];
}

/** The columns an import understands, as documented in every preview. */
export const IMPORT_COLUMNS: ImportColumn[] = IMPORT_COLUMN_DEFS.map(({ kind: _kind, ...c }) => ({
  ...c,
  aliases: [...new Set(c.aliases)],
}));

/** How a file is read, shown on the import page before the first upload and in every preview. */
export const IMPORT_RULES = [
  'Row 1 is the header; headers are matched without regard to case, spaces, underscores, hyphens or brackets.',
  "contains: 'none' means the supplier states there are no allergens (verified none); an empty cell means no allergen statement (unknown).",
  "may contain: an empty cell or 'none' means no precautionary statement.",
  'vegan, vegetarian: yes, no or unknown; an empty cell is unknown.',
  'Numbers may use a decimal point or a decimal comma; nutrition figures are per 100 g.',
  'A row whose id exists becomes a new revision of that ingredient: columns in the file replace its fields (an empty cell clears the field), fields without a column in the file keep their current value.',
  'Rows that are entirely empty are skipped. Each id may appear on one row only.',
];
