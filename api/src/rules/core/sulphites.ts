import type { DeclarationNotice, SulphiteResult } from '@crumbproof/shared';
import type { LeafFacts } from './allergens';
import { atThresholdPrecision, compare } from './compare';
import type { RegimeRules } from './reference-schema';

export interface SulphiteOutcome extends SulphiteResult {
  warnings: DeclarationNotice[];
}

/**
 * Total SO2 in the product as eaten: the sum over leaves of mass × stated mg/kg, divided by
 * the finished weight (after baking). Declared by the regime's own threshold and comparison:
 * EU and UK "concentrations of more than 10 mg/kg or 10 mg/litre in terms of the total SO2"
 * (Regulation (EU) No 1169/2011 Annex II point 12); Canada 10 p.p.m. or more (Food and Drug
 * Regulations B.01.010.1); ANZ added sulphites at 10 mg/kg or more (Food Standards Code
 * Standard 1.2.3 and Schedule 9); US 10 ppm or more (21 CFR 101.100(a)(4), from memory).
 * The figure is compared, and reported, at the threshold precision (compare.ts), so a product
 * worked out to exactly 10 mg/kg is at 10, not a hair to either side. A sulphite source with no
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
  const mgPerKg = atThresholdPrecision(finishedG > 0 ? mg / (finishedG / 1000) : 0);
  return { mgPerKg, declared: compare(mgPerKg, rules.sulphites.comparison, rules.sulphites.thresholdMgPerKg), warnings };
}
