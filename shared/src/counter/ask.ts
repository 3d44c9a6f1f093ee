import { z } from 'zod';
import { SOURCE_LABELS, type AllergenSource } from '../allergens';

/**
 * What the counter's lookup needs of a regime: its allergen groups, each with the sources it
 * covers and its label (from the regime's reference list). The caller passes them in; the lookup
 * reads no files.
 */
export interface CounterGroup {
  /** The regime's group code, e.g. 'gluten' (EU) or 'tree-nuts' (US). */
  code: string;
  label: string;
  /** The sources the group covers, e.g. ['wheat', 'spelt', …] for gluten. */
  sources: readonly AllergenSource[];
}

export interface CounterRules {
  groups: readonly CounterGroup[];
}

export const COUNTER_WANTS = ['vegan', 'vegetarian'] as const;
export type CounterWant = (typeof COUNTER_WANTS)[number];

/**
 * What a customer asks at the counter: what they must avoid (the regime's group codes, or a finer
 * source such as one tree nut, 'walnut') and what they want (vegan, vegetarian).
 */
export const customerAskSchema = z.strictObject({
  avoid: z
    .array(z.string({ error: 'Write each allergen to avoid as a code, such as "eggs" or "walnut".' }), {
      error: 'Give what the customer avoids as a list, such as ["eggs", "sesame"].',
    })
    .max(60, 'Pick at most 60 allergens to avoid.'),
  want: z
    .array(z.enum(COUNTER_WANTS, { error: `Pick what the customer wants from: ${COUNTER_WANTS.join(', ')}.` }), {
      error: 'Give what the customer wants as a list, such as ["vegan"].',
    })
    .max(COUNTER_WANTS.length),
});
export type CustomerAsk = z.infer<typeof customerAskSchema>;

/** One thing the customer avoids, with the groups it belongs to and the sources it covers. */
export interface AvoidItem {
  /** As asked: a group code ('nuts') or a source ('walnut'). */
  code: string;
  kind: 'group' | 'source';
  /** How it is said: the group's label, or the source's name. */
  label: string;
  /** The regime's groups that hold it: the group itself, or every group the source is a member of. */
  groups: string[];
  /** The sources it covers: all of the group's, or the one source. */
  sources: AllergenSource[];
}

const isSource = (code: string): code is AllergenSource => Object.prototype.hasOwnProperty.call(SOURCE_LABELS, code);

/**
 * Each avoided code as the regime knows it, or the problems with the ask. A code that is neither
 * one of the regime's groups nor a source one of them covers is refused: the declaration says
 * nothing of it (e.g. pine nut under the EU list, which does not declare it), so the counter could
 * only guess.
 */
export function resolveAsk(ask: CustomerAsk, rules: CounterRules): { ok: true; avoid: AvoidItem[] } | { ok: false; problems: string[] } {
  const problems: string[] = [];
  const avoid: AvoidItem[] = [];
  for (const [index, code] of ask.avoid.entries()) {
    if (avoid.some((a) => a.code === code)) continue;
    const group = rules.groups.find((g) => g.code === code);
    if (group) {
      avoid.push({ code, kind: 'group', label: group.label, groups: [group.code], sources: [...group.sources] });
      continue;
    }
    const holders = isSource(code) ? rules.groups.filter((g) => g.sources.includes(code)) : [];
    if (isSource(code) && holders.length > 0) {
      avoid.push({ code, kind: 'source', label: SOURCE_LABELS[code], groups: holders.map((g) => g.code), sources: [code] });
      continue;
    }
    const shown = code.length > 40 ? `${code.slice(0, 40)}…` : code;
    problems.push(
      isSource(code)
        ? `avoid.${index}: ${SOURCE_LABELS[code]} is not declared under this regime, so the record cannot answer for it; ask the kitchen.`
        : `avoid.${index}: unknown allergen '${shown}'. Use one of: ${rules.groups.map((g) => g.code).join(', ')}, or a source one of them covers.`,
    );
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, avoid };
}
