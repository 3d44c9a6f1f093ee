import type { DeclarationNotice, SulphiteResult } from '@crumbproof/shared';
import type { LeafFacts } from './allergens';
import { compare } from './compare';
import type { RegimeRules } from './reference-schema';

export interface SulphiteOutcome extends SulphiteResult {
  warnings: DeclarationNotice[];
}

/**
 * Total SO2 in the product as eaten: the sum over leaves of mass × stated mg/kg, divided by
 * the finished weight (after baking). Declared by the regime's own threshold and comparison
 * (EU/UK: more than 10 mg/kg; Canada, ANZ and US: 10 or more). A sulphite source with no
 * stated content, or one that only touches the product (contact line), cannot be computed:
 * it is declared, with a warning. A leaf with no allergen statement and no stated content
 * leaves the figure unknown (null); what is known still decides the declaration.
 */
export function sulphitesFor(all: LeafFacts[], finishedG: number, rules: RegimeRules): SulphiteOutcome {
  const warnings: DeclarationNotice[] = [];
  let mg = 0;
  let unstated = false;
  const seen = new Set<string>();
  for (const facts of all) {
    if (!facts.contains.some((u) => u.source === 'sulphites')) continue;
    const stated = facts.ingredient.sulphiteMgPerKg;
    const name = facts.ingredient.name;
    if (stated === undefined || facts.node.role === 'contact') {
      unstated = true;
      if (!seen.has(facts.ingredient.id)) {
        seen.add(facts.ingredient.id);
        warnings.push({
          code: 'sulphites-unstated',
          ingredient: facts.ingredient.id,
          message:
            stated === undefined
              ? `${name} contains sulphites but has no stated content (mg/kg); sulphites are declared. Add the supplier's figure to compute it.`
              : `${name} brings sulphites through a contact line, which has no weight; sulphites are declared.`,
        });
      }
      continue;
    }
    mg += (facts.node.massG / 1000) * stated;
  }
  if (unstated) return { mgPerKg: null, declared: true, warnings };
  // A leaf with no allergen statement and no stated content may hold sulphites: the figure is not known.
  if (all.some((f) => !f.known && f.ingredient.sulphiteMgPerKg === undefined)) {
    const known = finishedG > 0 ? mg / (finishedG / 1000) : 0;
    return { mgPerKg: null, declared: compare(known, rules.sulphites.comparison, rules.sulphites.thresholdMgPerKg), warnings };
  }
  const mgPerKg = finishedG > 0 ? mg / (finishedG / 1000) : 0;
  return { mgPerKg, declared: compare(mgPerKg, rules.sulphites.comparison, rules.sulphites.thresholdMgPerKg), warnings };
}
