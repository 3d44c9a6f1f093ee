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

/** The ingredients and recipes a write of the trail wrote, and whether it changed the kitchen's settings. */
export function touchedBy(e: AuditEventFull): Touched {
  if (e.action === 'kitchen.updated') return { kitchen: true, ids: new Set() };
  const ids = new Set<string>();
  if ((e.recordKind === 'ingredient' || e.recordKind === 'recipe') && e.recordId) ids.add(e.recordId);
  for (const v of [e.before, e.after])
    for (const kind of ['ingredients', 'recipes'] as const) for (const id of keysOf(v, kind)) ids.add(id);
  const site = e.action === 'book.imported' && (e.after as { site?: string } | null)?.site;
  return { kitchen: site === 'updated' || site === 'created', ids };
}

/**
 * The writes after an approval that reach a product: those that wrote an item it is made of now
 * or was made of when approved, or the kitchen's settings. Oldest first.
 */
export function causesFor(events: AuditEventFull[], since: Date, closure: ReadonlySet<string>, book: Book): ApprovalCause[] {
  const names = new Map([...book.ingredients, ...book.recipes].map((x) => [x.id, x.name]));
  const kindOf = (id: string): 'ingredient' | 'recipe' => (book.ingredients.some((i) => i.id === id) ? 'ingredient' : 'recipe');
  const out: ApprovalCause[] = [];
  for (const e of events) {
    if (e.at <= since) continue;
    const touched = touchedBy(e);
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
