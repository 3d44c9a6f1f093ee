import { bookRecipeSchema, type BookRecipe, type Claim, type LineRole, type Unit } from '@crumbproof/shared';
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
}

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
    };
  }
  return {
    id: recipe.id,
    name: recipe.name,
    lines: recipe.lines.map((line) => ({ use: line.use, qty: line.qty, unit: line.unit, role: line.role ?? 'ingredient' })),
    finishedWeightG: recipe.finishedWeightG,
    forSale: recipe.sale !== undefined,
    portionG: recipe.sale?.portionG,
    claims: recipe.sale?.claims ?? [],
    quid: recipe.sale?.quid ?? [],
  };
}

/** Checkbox groups hand back a string when one box is ticked, an array otherwise, false when none. */
function asList<T extends string>(value: unknown): T[] {
  if (Array.isArray(value)) return value as T[];
  if (typeof value === 'string' && value !== '') return [value as T];
  return [];
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
    lines: lines.map((line) => ({
      use: (line.use ?? '').trim(),
      qty: line.qty as number,
      unit: line.unit,
      ...(line.role === 'contact' ? { role: 'contact' as const } : {}),
    })),
    ...(values.finishedWeightG !== undefined && !Number.isNaN(values.finishedWeightG) ? { finishedWeightG: values.finishedWeightG } : {}),
    ...(values.forSale
      ? {
          sale: {
            portionG: values.portionG as number,
            ...(claims.length > 0 ? { claims } : {}),
            ...(quid.length > 0 ? { quid } : {}),
          },
        }
      : {}),
  };
  return recipe;
}

/** For number inputs: an empty box is "not given", never zero. */
export function numberOrUndefined(value: unknown): number | undefined {
  if (value === '' || value === null || value === undefined) return undefined;
  const n = typeof value === 'number' ? value : Number(value);
  return Number.isNaN(n) ? undefined : n;
}

const bookResolver = zodResolver(bookRecipeSchema);

/**
 * Validates with the API's own schema (bookRecipeSchema) on the recipe the form would send, then
 * puts each message back on the control it belongs to (sale.portionG → portionG).
 */
export const editorResolver: Resolver<EditorValues> = async (values, context, options) => {
  const result = await bookResolver(toBookRecipe(values), context, options as never);
  const errors = result.errors as FieldErrors<BookRecipe>;
  if (Object.keys(errors).length === 0) return { values, errors: {} };
  const { sale, ...rest } = errors;
  const mapped: FieldErrors<EditorValues> = { ...(rest as FieldErrors<EditorValues>) };
  if (sale && typeof sale === 'object') {
    const s = sale as { portionG?: FieldErrors[string]; claims?: FieldErrors[string]; quid?: FieldErrors[string] };
    if (s.portionG) mapped.portionG = s.portionG as never;
    if (s.claims) mapped.claims = s.claims as never;
    if (s.quid) mapped.quid = s.quid as never;
  }
  return { values: {}, errors: mapped };
};
