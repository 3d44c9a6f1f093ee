import type { ApprovalCause, Book, Role } from '@crumbproof/shared';
import type { AuditEventFull } from '../audit/audit.repository';

/** The writes that can change a declaration, as the audit trail names them. */
export const DECLARATION_WRITES = [
  'ingredient.saved',
  'recipe.saved',
  'book.imported',
  'ingredients.imported',
  'kitchen.updated',
  'swap.applied',
] as const;

type Touched = { kitchen: boolean; ids: Set<string> };

const keysOf = (v: unknown, kind: 'ingredients' | 'recipes'): string[] => {
  const part = v && typeof v === 'object' ? (v as Record<string, unknown>)[kind] : undefined;
  if (!part || typeof part !== 'object') return [];
  // A book import's summary lists ids as created and revised; every other write keys bodies by id.
  const summary = part as { created?: unknown; revised?: unknown };
  if (Array.isArray(summary.created) || Array.isArray(summary.revised))
    return [...((summary.created as string[]) ?? []), ...((summary.revised as string[]) ?? [])];
  return Object.keys(part);
};

/** A kitchen as the trail names it: its number (a settings change's record) and its id in the book (an import's summary). */
export interface CauseKitchen {
  id: number;
  code: string | null;
}

/**
 * The ingredients and recipes a write of the trail wrote, and whether it changed this kitchen's
 * settings: a change of another kitchen's settings, or an import that left this kitchen as it was,
 * changes nothing here. The recipe book is shared, so every item written counts at every kitchen.
 */
export function touchedBy(e: AuditEventFull, kitchen: CauseKitchen): Touched {
  if (e.action === 'kitchen.updated') return { kitchen: e.recordId === String(kitchen.id), ids: new Set() };
  const ids = new Set<string>();
  if ((e.recordKind === 'ingredient' || e.recordKind === 'recipe') && e.recordId) ids.add(e.recordId);
  for (const v of [e.before, e.after])
    for (const kind of ['ingredients', 'recipes'] as const) for (const id of keysOf(v, kind)) ids.add(id);
  let site: string | undefined;
  if (e.action === 'book.imported') {
    // An import names each kitchen by its id in the book; a book given as site names its one
    // kitchen 'site' (the installation had one kitchen then, so any approval here came after it),
    // and one from before there were several kitchens names it only as site.
    const summary = e.after as { site?: string; kitchens?: Record<string, string> } | null;
    site = summary?.kitchens ? (summary.kitchens[kitchen.code ?? 'site'] ?? summary.kitchens.site) : summary?.site;
  }
  return { kitchen: site === 'updated' || site === 'created', ids };
}

/**
 * The writes after an approval at a kitchen that reach a product there: those that wrote an item
 * it is made of at that kitchen now or was made of when approved, or that kitchen's settings. Oldest first.
 */
export function causesFor(
  events: AuditEventFull[],
  since: Date,
  closure: ReadonlySet<string>,
  book: Book,
  kitchen: CauseKitchen,
): ApprovalCause[] {
  const names = new Map([...book.ingredients, ...book.recipes].map((x) => [x.id, x.name]));
  const kindOf = (id: string): 'ingredient' | 'recipe' => (book.ingredients.some((i) => i.id === id) ? 'ingredient' : 'recipe');
  const out: ApprovalCause[] = [];
  for (const e of events) {
    if (e.at <= since) continue;
    const touched = touchedBy(e, kitchen);
    const hit = [...touched.ids].filter((id) => closure.has(id));
    if (!touched.kitchen && hit.length === 0) continue;
    out.push({
      at: e.at.toISOString(),
      by: e.actorName,
      role: e.actorRole as Role | null,
      action: e.action,
      summary: e.summary,
      items: [
        ...(touched.kitchen ? [{ kind: 'kitchen' as const, id: 'kitchen', name: 'The kitchen’s settings' }] : []),
        ...hit.map((id) => ({ kind: kindOf(id), id, name: names.get(id) ?? id })),
      ],
    });
  }
  return out;
}
