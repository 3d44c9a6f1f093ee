import { bookRecipeSchema, type BookRecipe, type Claim, type DateMark, type LineRole, type Sale, type Unit } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldErrors, Resolver } from 'react-hook-form';

export interface EditorLine {
  use: string;
  qty: number | undefined;
  unit: Unit;
  role: LineRole;
}

/** The editor's form: the book recipe flattened so every control has a plain field name. */
export interface EditorValues {
  id: string;
  name: string;
  lines: EditorLine[];
  finishedWeightG: number | undefined;
  forSale: boolean;
  portionG: number | undefined;
  claims: Claim[];
  quid: string[];
  /** Print details: what a label of the product prints besides its declaration. Empty boxes are "not given". */
  shelfLifeDays: number | undefined;
  dateMark: DateMark | '';
  storage: string;
  netWeightG: number | undefined;
  gtin: string;
  unitsPerCase: number | undefined;
  caseGtin: string;
  /** Shown on the kitchen's public product page (sale.published). */
  published: boolean;
}

/** The print details, each a field of the book's sale and of the form under the same name. */
export const PRINT_DETAIL_FIELDS = ['shelfLifeDays', 'dateMark', 'storage', 'netWeightG', 'gtin', 'unitsPerCase', 'caseGtin'] as const;
type PrintDetailField = (typeof PRINT_DETAIL_FIELDS)[number];

export const EMPTY_LINE: EditorLine = { use: '', qty: undefined, unit: 'g', role: 'ingredient' };

export function toEditorValues(recipe: BookRecipe | null): EditorValues {
  if (!recipe) {
    return {
      id: '',
      name: '',
      lines: [{ ...EMPTY_LINE }],
      finishedWeightG: undefined,
      forSale: false,
      portionG: undefined,
      claims: [],
      quid: [],
      shelfLifeDays: undefined,
      dateMark: '',
      storage: '',
      netWeightG: undefined,
      gtin: '',
      unitsPerCase: undefined,
      caseGtin: '',
      published: false,
    };
  }
  const sale = recipe.sale;
  return {
    id: recipe.id,
    name: recipe.name,
    lines: recipe.lines.map((line) => ({ use: line.use, qty: line.qty, unit: line.unit ?? 'g', role: line.role ?? 'ingredient' })),
    finishedWeightG: recipe.finishedWeightG,
    forSale: recipe.sale !== undefined,
    portionG: sale?.portionG,
    claims: sale?.claims ?? [],
    quid: sale?.quid ?? [],
    shelfLifeDays: sale?.shelfLifeDays,
    dateMark: sale?.dateMark ?? '',
    storage: sale?.storage ?? '',
    netWeightG: sale?.netWeightG,
    gtin: sale?.gtin ?? '',
    unitsPerCase: sale?.unitsPerCase,
    caseGtin: sale?.caseGtin ?? '',
    published: sale?.published === true,
  };
}

/** Checkbox groups hand back a string when one box is ticked, an array otherwise, false when none. */
function asList<T extends string>(value: unknown): T[] {
  if (Array.isArray(value)) return value as T[];
  if (typeof value === 'string' && value !== '') return [value as T];
  return [];
}

const given = (n: number | undefined): n is number => n !== undefined && !Number.isNaN(n);

/** The print details that were filled in, as the book's sale holds them (a blank box is left out). */
function printDetails(values: EditorValues): Partial<Pick<Sale, PrintDetailField>> {
  const text = (value: string | undefined) => (value ?? '').trim();
  return {
    ...(given(values.shelfLifeDays) ? { shelfLifeDays: values.shelfLifeDays } : {}),
    ...(values.dateMark ? { dateMark: values.dateMark } : {}),
    ...(text(values.storage) ? { storage: text(values.storage) } : {}),
    ...(given(values.netWeightG) ? { netWeightG: values.netWeightG } : {}),
    ...(text(values.gtin) ? { gtin: text(values.gtin) } : {}),
    ...(given(values.unitsPerCase) ? { unitsPerCase: values.unitsPerCase } : {}),
    ...(text(values.caseGtin) ? { caseGtin: text(values.caseGtin) } : {}),
  };
}

/** The recipe exactly as the API will receive it. */
export function toBookRecipe(values: EditorValues): BookRecipe {
  const lines = values.lines ?? [];
  const uses = new Set(lines.map((line) => line.use));
  const claims = asList<Claim>(values.claims);
  const quid = asList<string>(values.quid).filter((id) => uses.has(id));
  const recipe = {
    id: (values.id ?? '').trim(),
    name: values.name ?? '',
    // A contact line takes no weight: whatever its boxes held, it is sent without a quantity.
    lines: lines.map((line) =>
      line.role === 'contact'
        ? { use: (line.use ?? '').trim(), role: 'contact' as const }
        : { use: (line.use ?? '').trim(), qty: line.qty as number, unit: line.unit },
    ),
    ...(values.finishedWeightG !== undefined && !Number.isNaN(values.finishedWeightG) ? { finishedWeightG: values.finishedWeightG } : {}),
    ...(values.forSale
      ? {
          sale: {
            portionG: values.portionG as number,
            ...(claims.length > 0 ? { claims } : {}),
            ...(quid.length > 0 ? { quid } : {}),
            ...printDetails(values),
            ...(values.published ? { published: true } : {}),
          },
        }
      : {}),
  };
  return recipe;
}

export { numberOrUndefined } from '@/lib/number-input';

const bookResolver = zodResolver(bookRecipeSchema);

/**
 * Validates with the API's own schema (bookRecipeSchema) on the recipe the form would send, then
 * puts each message back on the control it belongs to (sale.portionG → portionG, sale.gtin → gtin).
 */
export const editorResolver: Resolver<EditorValues> = async (values, context, options) => {
  const result = await bookResolver(toBookRecipe(values), context, options as never);
  const errors = result.errors as FieldErrors<BookRecipe>;
  if (Object.keys(errors).length === 0) return { values, errors: {} };
  const { sale, ...rest } = errors;
  const mapped: FieldErrors<EditorValues> = { ...(rest as FieldErrors<EditorValues>) };
  if (sale && typeof sale === 'object') {
    const s = sale as Partial<Record<'portionG' | 'claims' | 'quid' | PrintDetailField, FieldErrors[string]>>;
    for (const field of ['portionG', 'claims', 'quid', ...PRINT_DETAIL_FIELDS] as const) {
      if (s[field]) mapped[field] = s[field] as never;
    }
  }
  return { values: {}, errors: mapped };
};
