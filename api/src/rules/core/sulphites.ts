import type { DeclarationNotice, SulphiteGap, SulphiteResult, SulphiteStatus } from '@crumbproof/shared';
import type { Leaf } from './allergens';
import { atThresholdPrecision, compare } from './compare';
import type { RegimeRules } from './reference-schema';

export interface SulphiteOutcome extends SulphiteResult {
  warnings: DeclarationNotice[];
}

/**
 * Total SO2 in the product as eaten: the sum over leaves of mass × stated mg/kg, divided by
 * the finished weight (after baking), compared with the regime's own threshold: EU and UK
 * "concentrations of more than 10 mg/kg or 10 mg/litre in terms of the total SO2"
 * (Regulation (EU) No 1169/2011 Annex II point 12); Canada 10 p.p.m. or more (Food and Drug
 * Regulations B.01.010.1); ANZ added sulphites at 10 mg/kg or more (Food Standards Code
 * Standard 1.2.3 and Schedule 9); US 10 ppm or more (21 CFR 101.100(a)(4), from memory).
 * Figures are compared, and reported, at the threshold precision (compare.ts).
 *
 * What is known decides the status, and unknown data never reads as below the threshold:
 * - a sulphite source with no stated content, or one that only touches the product (a contact
 *   line, no weight): sulphites are in the food and nothing shows them to be at or under the
 *   threshold, so they are declared, amount not stated. Every regime above exempts sulphites
 *   only by their concentration; treating an unstated figure as declarable is common practice;
 * - a leaf with no allergen statement and no stated content may bring sulphites: the total is
 *   not known. The stated contents still decide when they alone compare above the threshold
 *   (a missing figure can only add); otherwise the status is 'not-known', with a
 *   'sulphites-not-known' warning naming each such ingredient;
 * - below the threshold only when every leaf is known and the total compares below.
 */
export function sulphitesFor(all: readonly Leaf[], finishedG: number, rules: RegimeRules): SulphiteOutcome {
  const warnings: DeclarationNotice[] = [];
  const missing: SulphiteGap[] = [];
  const addMissing = (facts: Leaf['facts'], reason: SulphiteGap['reason']): boolean => {
    if (missing.some((m) => m.ingredient === facts.ingredient.id)) return false;
    missing.push({ ingredient: facts.ingredient.id, name: facts.ingredient.name, reason });
    return true;
  };

  let mg = 0;
  for (const leaf of all) {
    const facts = leaf.facts;
    const stated = facts.ingredient.sulphiteMgPerKg;
    const name = facts.ingredient.name;
    if (facts.contains.some((u) => u.source === 'sulphites')) {
      if (stated === undefined || leaf.contact) {
        const reason = stated === undefined ? 'content-not-stated' : 'contact-line';
        if (addMissing(facts, reason)) {
          warnings.push({
            code: 'sulphites-unstated',
            ingredient: facts.ingredient.id,
            message:
              reason === 'content-not-stated'
                ? `${name} contains sulphites but has no stated content (mg/kg): sulphites are declared, amount not stated. Add the supplier's figure to compute it.`
                : `${name} brings sulphites through a contact line, which has no weight: sulphites are declared, amount not stated.`,
          });
        }
        continue;
      }
      mg += (leaf.massG / 1000) * stated;
    } else if (!facts.known && stated === undefined) {
      addMissing(facts, 'no-allergen-statement');
    }
  }

  const statedMgPerKg = atThresholdPrecision(finishedG > 0 ? mg / (finishedG / 1000) : 0);
  const aboveThreshold = compare(statedMgPerKg, rules.sulphites.comparison, rules.sulphites.thresholdMgPerKg);
  const sourceUnstated = missing.some((m) => m.reason !== 'no-allergen-statement');
  const status: SulphiteStatus = aboveThreshold || sourceUnstated ? 'declared' : missing.length > 0 ? 'not-known' : 'below-threshold';

  if (status === 'not-known') {
    const t = rules.sulphites.thresholdMgPerKg;
    const limit = rules.sulphites.comparison === 'gt' ? `more than ${t} mg/kg` : `${t} mg/kg or more`;
    for (const gap of missing) {
      warnings.push({
        code: 'sulphites-not-known',
        ingredient: gap.ingredient,
        message: `Sulphites not known: ${gap.name} has no allergen statement and no stated sulphite content, so whether the product's sulphites are declared (${limit} as eaten) is not known. Record its allergen statement or its sulphite content (mg/kg) before labelling.`,
      });
    }
  }

  return {
    status,
    mgPerKg: missing.length === 0 ? statedMgPerKg : null,
    statedMgPerKg,
    declared: status === 'declared',
    missing,
    warnings,
  };
}
