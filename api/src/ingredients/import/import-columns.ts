import {
  ALLERGEN_SOURCES,
  cellPlace,
  EXEMPT_FORMS,
  EXEMPT_FORM_LABELS,
  SOURCE_LABELS,
  SPECIES_SOURCES,
  type AllergenSource,
  type BookIngredient,
  type ExemptForm,
  IMPORT_COLUMN_DEFS,
  type ImportColumnDef,
  type IssuePlace,
  type SourceEntry,
} from '@crumbproof/shared';

/** A cell as read from a CSV (always text) or a workbook (text, number, yes/no). */
export type Cell = string | number | boolean | null;

type NutrientKey = 'energyKj' | 'energyKcal' | 'fat' | 'saturates' | 'carbohydrate' | 'sugars' | 'fibre' | 'protein' | 'salt';
type ColumnDef = ImportColumnDef;
const DEFS: ColumnDef[] = IMPORT_COLUMN_DEFS;

/** "Supplier_Code", " Fat (g/100 g) " → "supplier code", "fat g/100 g". */
export function normaliseHeader(h: string): string {
  return h
    .toLowerCase()
    .replace(/[()_\-[\]]/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

const BY_HEADER = new Map<string, ColumnDef>();
for (const def of DEFS) for (const h of [def.header, ...def.aliases]) BY_HEADER.set(normaliseHeader(h), def);

export interface HeaderMap {
  /** Column index → definition, for the columns understood. */
  columns: Map<number, ColumnDef>;
  /** Field → its header as written in row 1, to name the column as the file does. */
  names: Map<string, string>;
  /** Indexes of header cells left empty: anything under them is a problem of its row. */
  blank: Set<number>;
  /** How many cells the header row has. */
  width: number;
  problems: string[];
}

/** Reads the header row: every cell must name a known column once; id and name must be there. */
export function mapHeader(header: Cell[]): HeaderMap {
  const columns = new Map<number, ColumnDef>();
  const blank = new Set<number>();
  const problems: string[] = [];
  const seen = new Map<string, string>();
  header.forEach((cell, i) => {
    const text = cellText(cell);
    if (text === '') {
      blank.add(i);
      return;
    }
    const def = BY_HEADER.get(normaliseHeader(text));
    if (!def) {
      const near = closest(normaliseHeader(text), [...BY_HEADER.keys()]);
      problems.push(
        `The column '${text}' is not one this import understands${near ? `; did you mean '${near}'?` : '.'} The columns are: ${DEFS.map((d) => d.header).join(', ')}.`,
      );
      return;
    }
    const before = seen.get(def.field);
    if (before !== undefined) {
      problems.push(`The columns '${before}' and '${text}' are both '${def.header}'; keep one.`);
      return;
    }
    seen.set(def.field, text);
    columns.set(i, def);
  });
  for (const def of DEFS.filter((d) => d.required)) {
    if (!seen.has(def.field)) problems.push(`The header row has no '${def.header}' column; every ingredient needs one.`);
  }
  return { columns, names: seen, blank, width: header.length, problems };
}

export function cellText(cell: Cell): string {
  if (cell === null) return '';
  if (typeof cell === 'boolean') return cell ? 'yes' : 'no';
  return String(cell).trim();
}

const quote = (cell: Cell) => `'${cellText(cell)}'`;

/**
 * Where in the sheet an ingredient path is: "row 4, column Contains", the column named as row 1
 * of the file names it (or by its usual header when the file has no such column).
 */
export function rowPlace(header: HeaderMap, row: number): IssuePlace {
  return cellPlace(row, (path) => {
    const field = path.length > 1 && path[0] === 'nutrition' ? `nutrition.${String(path[1])}` : String(path[0] ?? '');
    return header.names.get(field) ?? DEFS.find((d) => d.field === field)?.header;
  });
}

/**
 * Turns one spreadsheet row (numbered as the spreadsheet program shows it) into the ingredient it
 * describes. Columns the file has replace the field (an empty cell clears it); fields the file has
 * no column for are kept from `base`, the ingredient as it stands (or left out for a new one).
 */
export function rowToCandidate(
  cells: Cell[],
  header: HeaderMap,
  base: BookIngredient | undefined,
  row: number,
): { candidate: Record<string, unknown>; problems: string[] } {
  const place = rowPlace(header, row);
  const problems: string[] = [];
  const out: Record<string, unknown> = base ? structuredClone(base) : { vegan: null, vegetarian: null };
  const nutrition: Record<string, unknown> = { ...(base?.nutrition ?? {}) };
  for (const [i, def] of header.columns) {
    const cell = cells[i] ?? null;
    const text = cellText(cell);
    const [field, sub] = def.field.split('.') as [string, NutrientKey | undefined];
    const at = `${place(def.field.split('.'))}: `;
    const set = (value: unknown) => {
      if (sub) {
        if (value === undefined) delete nutrition[sub];
        else nutrition[sub] = value;
      } else if (value === undefined) delete out[field];
      else out[field] = value;
    };
    switch (def.kind) {
      case 'text':
        set(text === '' ? (def.required ? '' : undefined) : text);
        break;
      case 'diet': {
        const v = parseDiet(text);
        if (v === 'bad') problems.push(`${at}${quote(cell)} is not yes, no or unknown.`);
        else set(v);
        break;
      }
      case 'number': {
        const v = parseNumber(cell);
        if (v === 'bad') problems.push(`${at}${quote(cell)} is not a number.`);
        else set(v);
        break;
      }
      case 'sources': {
        const parsed = parseSources(text);
        for (const p of parsed.problems) problems.push(`${at}${p}`);
        if (parsed.problems.length === 0) set(parsed.entries ?? (field === 'mayContain' ? [] : undefined));
        break;
      }
    }
  }
  if (Object.keys(nutrition).length > 0) out.nutrition = nutrition;
  else delete out.nutrition;
  return { candidate: out, problems };
}

function parseDiet(text: string): boolean | null | 'bad' {
  const t = text.toLowerCase();
  if (['yes', 'y', 'true', '1'].includes(t)) return true;
  if (['no', 'n', 'false', '0'].includes(t)) return false;
  if (['', 'unknown', '?', 'not known'].includes(t)) return null;
  return 'bad';
}

function parseNumber(cell: Cell): number | undefined | 'bad' {
  if (typeof cell === 'number') return Number.isFinite(cell) ? cell : 'bad';
  const t = cellText(cell);
  if (t === '') return undefined;
  const decimalComma = /^[+-]?\d+,\d+$/.test(t) ? t.replace(',', '.') : t;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(decimalComma)) return 'bad';
  return Number(decimalComma);
}

const SYNONYMS: Record<string, AllergenSource> = {
  soya: 'soy',
  soybean: 'soy',
  soybeans: 'soy',
  'soya bean': 'soy',
  'soya beans': 'soy',
  sulfites: 'sulphites',
  sulfite: 'sulphites',
  sulphite: 'sulphites',
  'sulphur dioxide': 'sulphites',
  'sulfur dioxide': 'sulphites',
  eggs: 'egg',
  'sesame seeds': 'sesame',
  'sesame seed': 'sesame',
  'brazil nuts': 'brazil-nut',
  brazil: 'brazil-nut',
  kamut: 'khorasan',
  'khorasan wheat': 'khorasan',
  crustaceans: 'crustacean',
  molluscs: 'mollusc',
};
const GROUP_HINTS: Record<string, string> = {
  gluten: `name the cereal instead (${['wheat', 'rye', 'barley', 'oats', 'spelt', 'khorasan', 'triticale'].join(', ')})`,
  cereals: `name the cereal instead (${['wheat', 'rye', 'barley', 'oats', 'spelt', 'khorasan', 'triticale'].join(', ')})`,
  nuts: `name each nut instead (${['almond', 'hazelnut', 'walnut', 'cashew', 'pecan', 'brazil-nut', 'pistachio', 'macadamia', 'pine-nut'].join(', ')})`,
  'tree nuts': `name each nut instead (${['almond', 'hazelnut', 'walnut', 'cashew', 'pecan', 'brazil-nut', 'pistachio', 'macadamia', 'pine-nut'].join(', ')})`,
  shellfish: "name 'crustacean' or 'mollusc' instead",
  dairy: "use 'milk'",
  lactose: "use 'milk'",
};

const SOURCE_NAMES = new Map<string, AllergenSource>();
for (const s of ALLERGEN_SOURCES) {
  SOURCE_NAMES.set(s, s);
  SOURCE_NAMES.set(s.replace(/-/g, ' '), s);
  SOURCE_NAMES.set(SOURCE_LABELS[s].toLowerCase(), s);
}
for (const [k, v] of Object.entries(SYNONYMS)) SOURCE_NAMES.set(k, v);

const FORM_NAMES = new Map<string, ExemptForm>();
for (const f of EXEMPT_FORMS) {
  FORM_NAMES.set(f, f);
  FORM_NAMES.set(f.replace(/-/g, ' '), f);
  FORM_NAMES.set(EXEMPT_FORM_LABELS[f].toLowerCase(), f);
}

function resolveSource(token: string): AllergenSource | undefined {
  const t = token.toLowerCase().replace(/\s+/g, ' ');
  return SOURCE_NAMES.get(t) ?? SOURCE_NAMES.get(t.replace(/s$/, '')) ?? SOURCE_NAMES.get(t.replace(/es$/, ''));
}

/**
 * "wheat; milk" → ['wheat', 'milk']; "none" → [] (verified none); "" → undefined (no statement).
 * Every token that is not a source is a problem naming it, with the nearest source when one is close.
 */
export function parseSources(text: string): { entries?: SourceEntry[]; problems: string[] } {
  if (text.trim() === '') return { problems: [] };
  const tokens = text
    .split(/[;,]/)
    .map((s) => s.trim())
    .filter((s) => s !== '');
  if (tokens.length === 1 && tokens[0].toLowerCase() === 'none') return { entries: [], problems: [] };
  const problems: string[] = [];
  const entries: SourceEntry[] = [];
  const seen = new Set<string>();
  for (const token of tokens) {
    if (token.toLowerCase() === 'none') {
      problems.push("'none' cannot be listed with allergen sources; write 'none' alone, or only the sources.");
      continue;
    }
    const m = /^(.+?)\s*\((.*)\)$/.exec(token);
    const name = m ? m[1] : token;
    const source = resolveSource(name);
    if (!source) {
      problems.push(notASource(name));
      continue;
    }
    let entry: SourceEntry = source;
    if (m) {
      const qualifier = m[2].trim();
      const form = FORM_NAMES.get(qualifier.toLowerCase().replace(/\s+/g, ' '));
      if (form) entry = { source, form };
      else if (SPECIES_SOURCES.includes(source) && qualifier !== '') entry = { source, species: qualifier };
      else {
        problems.push(
          `'${qualifier}' in '${token}' is not an exempt form${SPECIES_SOURCES.includes(source) ? ' or a species' : ''}; the forms are: ${EXEMPT_FORMS.join(', ')}.`,
        );
        continue;
      }
    }
    const key = JSON.stringify(entry);
    if (seen.has(key)) continue;
    seen.add(key);
    entries.push(entry);
  }
  return problems.length > 0 ? { problems } : { entries, problems };
}

function notASource(token: string): string {
  const hint = GROUP_HINTS[token.toLowerCase().replace(/\s+/g, ' ')];
  if (hint) return `'${token}' is not an allergen source; ${hint}.`;
  const near = closest(token.toLowerCase(), [...ALLERGEN_SOURCES]);
  if (near) return `'${token}' is not an allergen source; did you mean '${near}'?`;
  return `'${token}' is not an allergen source. The sources are: ${ALLERGEN_SOURCES.join(', ')}.`;
}

/** The candidate within two edits (a swap of neighbours counts as one), when there is exactly one nearest. */
export function closest(word: string, candidates: string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  let tie = false;
  for (const c of candidates) {
    const d = editDistance(word, c);
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
      tie = false;
    } else if (d === bestDistance && c !== best) tie = true;
  }
  const limit = word.length <= 4 ? 1 : 2;
  return best !== undefined && bestDistance <= limit && !tie ? best : undefined;
}

function editDistance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) =>
    Array.from({ length: b.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)),
  );
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}
