import { z } from 'zod';

/**
 * Fine-grained allergen sources recorded on ingredients. Each regime's reference list
 * (reference-data/regimes.json) decides which group a source belongs to, or none.
 */
export const ALLERGEN_SOURCES = [
  'wheat',
  'rye',
  'barley',
  'oats',
  'spelt',
  'khorasan',
  'triticale',
  'almond',
  'hazelnut',
  'walnut',
  'cashew',
  'pecan',
  'brazil-nut',
  'pistachio',
  'macadamia',
  'pine-nut',
  'coconut',
  'peanut',
  'soy',
  'milk',
  'egg',
  'fish',
  'crustacean',
  'mollusc',
  'celery',
  'mustard',
  'sesame',
  'lupin',
  'sulphites',
] as const;
export type AllergenSource = (typeof ALLERGEN_SOURCES)[number];

/** A value as a message shows it: 'quinoa', or the JSON of anything that is not text. */
function shown(value: unknown): string {
  if (typeof value === 'string') return `'${value.length > 40 ? `${value.slice(0, 40)}…` : value}'`;
  let json: string;
  try {
    json = JSON.stringify(value) ?? String(value);
  } catch {
    // Nested too deep for JSON.stringify (a request can nest lists thousands deep).
    json = Array.isArray(value) ? '[[…]]' : '{…}';
  }
  return json.length > 40 ? `${json.slice(0, 40)}…` : json;
}

/** The message for a value not in a list: which value, and every accepted one. */
export function notInListMessage(what: string, value: unknown, accepted: readonly string[]): string {
  if (value === undefined) return `Give the ${what}, one of: ${accepted.join(', ')}.`;
  return `Unknown ${what} ${shown(value)}. Use one of: ${accepted.join(', ')}.`;
}

/** An allergen source, refused with a message that names the unknown value and lists the accepted ones. */
export const allergenSourceSchema = z.enum(ALLERGEN_SOURCES, {
  error: (issue) => notInListMessage('allergen source', issue.input, ALLERGEN_SOURCES),
});

export const SOURCE_LABELS: Record<AllergenSource, string> = {
  wheat: 'wheat',
  rye: 'rye',
  barley: 'barley',
  oats: 'oats',
  spelt: 'spelt',
  khorasan: 'khorasan wheat',
  triticale: 'triticale',
  almond: 'almond',
  hazelnut: 'hazelnut',
  walnut: 'walnut',
  cashew: 'cashew',
  pecan: 'pecan',
  'brazil-nut': 'Brazil nut',
  pistachio: 'pistachio',
  macadamia: 'macadamia',
  'pine-nut': 'pine nut',
  coconut: 'coconut',
  peanut: 'peanut',
  soy: 'soy',
  milk: 'milk',
  egg: 'egg',
  fish: 'fish',
  crustacean: 'crustacean',
  mollusc: 'mollusc',
  celery: 'celery',
  mustard: 'mustard',
  sesame: 'sesame',
  lupin: 'lupin',
  sulphites: 'sulphites',
};

/** Sources whose species the US statement must name (fish, crustacean shellfish). */
export const SPECIES_SOURCES: readonly AllergenSource[] = ['fish', 'crustacean', 'mollusc'];

/**
 * Processed forms of a source that some regimes exempt from declaration
 * (EU 1169/2011 Annex II exceptions; FD&C Act 201(qq) highly refined oils).
 */
export const EXEMPT_FORMS = [
  'glucose-syrup',
  'dextrose',
  'maltodextrin',
  'distillate',
  'refined-oil',
  'tocopherols',
  'phytosterols',
  'plant-stanol-ester',
  'lactitol',
  'fish-gelatine-carrier',
  'isinglass-fining',
] as const;
export type ExemptForm = (typeof EXEMPT_FORMS)[number];

/** An exempt form, refused with a message that names the unknown value and lists the accepted ones. */
export const exemptFormSchema = z.enum(EXEMPT_FORMS, {
  error: (issue) => notInListMessage('allergen form', issue.input, EXEMPT_FORMS),
});

export const EXEMPT_FORM_LABELS: Record<ExemptForm, string> = {
  'glucose-syrup': 'glucose syrup',
  dextrose: 'dextrose',
  maltodextrin: 'maltodextrin',
  distillate: 'used for an alcoholic distillate',
  'refined-oil': 'fully or highly refined oil',
  tocopherols: 'natural tocopherols (E306)',
  phytosterols: 'phytosterols and esters',
  'plant-stanol-ester': 'plant stanol ester',
  lactitol: 'lactitol',
  'fish-gelatine-carrier': 'fish gelatine as vitamin carrier',
  'isinglass-fining': 'isinglass as fining agent',
};

export const REGIMES = ['EU', 'UK', 'US', 'CA', 'ANZ'] as const;
export type Regime = (typeof REGIMES)[number];
export const REGIME_LABELS: Record<Regime, string> = {
  EU: 'European Union',
  UK: 'United Kingdom',
  US: 'United States',
  CA: 'Canada',
  ANZ: 'Australia and New Zealand',
};

export const CONTROLS = ['segregated', 'shared-equipment', 'shared-area'] as const;
export type Control = (typeof CONTROLS)[number];
export const CONTROL_LABELS: Record<Control, string> = {
  segregated: 'kept apart',
  'shared-equipment': 'shared equipment in this kitchen',
  'shared-area': 'handled in the same area of this kitchen',
};

export const CLAIMS = ['vegan', 'vegetarian', 'egg-free', 'dairy-free', 'gluten-free', 'nut-free', 'peanut-free', 'sesame-free'] as const;
export type Claim = (typeof CLAIMS)[number];
export const CLAIM_LABELS: Record<Claim, string> = {
  vegan: 'Vegan',
  vegetarian: 'Vegetarian',
  'egg-free': 'Egg-free',
  'dairy-free': 'Dairy-free',
  'gluten-free': 'Gluten-free',
  'nut-free': 'Nut-free',
  'peanut-free': 'Peanut-free',
  'sesame-free': 'Sesame-free',
};
export type ClaimStatus = 'ok' | 'fails' | 'unverified';

/** Household measures differ by country; the kitchen chooses (default follows the regime). */
export const MEASURE_SYSTEMS = ['metric', 'us-customary', 'australian'] as const;
export type MeasureSystem = (typeof MEASURE_SYSTEMS)[number];

export const UNITS = ['g', 'kg', 'ml', 'l', 'tsp', 'tbsp', 'cup', 'each'] as const;
export type Unit = (typeof UNITS)[number];
export const LINE_ROLES = ['ingredient', 'contact'] as const;
export type LineRole = (typeof LINE_ROLES)[number];
