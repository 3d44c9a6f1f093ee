import { z } from 'zod';
import { ALLERGEN_SOURCES, CLAIMS, COMPARISONS, EXEMPT_FORMS, REGIMES, type Comparison } from '@crumbproof/shared';

/**
 * The shape of reference-data/*.json. The loader validates each file with these schemas;
 * the core receives the parsed result and never reads files itself.
 */
const source = z.enum(ALLERGEN_SOURCES);
const basis = z.string().min(10, 'Name the published source of this rule.');

export const allergenGroupSchema = z.strictObject({
  code: z.string().regex(/^[a-z][a-z-]*$/),
  label: z.string().min(1),
  members: z.array(source).min(1),
  /** The statement names the species (fish, crustaceans, molluscs) where recorded. */
  nameSpecies: z.boolean().optional(),
  source: basis,
});
export type AllergenGroup = z.infer<typeof allergenGroupSchema>;

export const sourceNameSchema = z.strictObject({
  /** The name printed for this source, e.g. 'soya' or 'pine nut'. */
  name: z.string().min(1),
  /** Words that count as naming it inside an ingredient's name (defaults to `name`). */
  match: z.array(z.string().min(1)).optional(),
  /** A second name the label must also give, e.g. 'wheat' after 'spelt'. */
  also: z.string().min(1).optional(),
});
export type SourceName = z.infer<typeof sourceNameSchema>;

export const exemptionSchema = z.strictObject({
  source,
  form: z.enum(EXEMPT_FORMS),
  declared: z.boolean(),
  basis,
});
export type Exemption = z.infer<typeof exemptionSchema>;

export { COMPARISONS, type Comparison };

export const regimeRulesSchema = z.strictObject({
  name: z.string().min(1),
  sources: z.array(z.string().min(1)).min(1),
  groups: z.array(allergenGroupSchema).min(1),
  sourceNames: z.partialRecord(source, sourceNameSchema),
  exemptions: z.array(exemptionSchema),
  sulphites: z.strictObject({
    thresholdMgPerKg: z.number().min(0),
    comparison: z.enum(['gt', 'gte']),
    /** Printed name: 'sulphites' or 'sulfites'. */
    name: z.string().min(1),
    /** The group code that carries sulphites in `contains`, or null where they are no allergen group (US). */
    group: z.string().nullable(),
    /** Name sulphites beside the ingredient in the list. */
    markInList: z.boolean(),
    basis,
  }),
  glutenFree: z.strictObject({
    limitMgPerKg: z.number().min(0),
    comparison: z.enum(['lt', 'lte']),
    /** Sources that are gluten-containing cereals for the claim. */
    cereals: z.array(source).min(1),
    /** 'gluten-cereal': oats need a measured figure; 'measured': oats need one too, but are no gluten grain; 'not-permitted': oats fail. */
    oats: z.enum(['gluten-cereal', 'measured', 'not-permitted']),
    basis,
  }),
  freeFrom: z.strictObject({
    'egg-free': z.array(source).min(1),
    'dairy-free': z.array(source).min(1),
    'nut-free': z.array(source).min(1),
    'peanut-free': z.array(source).min(1),
    'sesame-free': z.array(source).min(1),
  }),
  statement: z.strictObject({
    heading: z.string(),
    /** Emphasise (and if need be add) the allergen's name for each ingredient in the list. */
    marksInList: z.boolean(),
    contains: z
      .strictObject({
        prefix: z.string().min(1),
        /** 'sources': name each source (species, cereal) once; 'groups': the group labels. */
        names: z.enum(['sources', 'groups']),
        bold: z.boolean(),
      })
      .nullable(),
    basis,
  }),
  addedWater: z.strictObject({
    /** Added water at or below this share of the finished product need not be listed; null: always listed. */
    omitUpToPercent: z.number().min(0).max(100).nullable(),
    basis,
  }),
});
export type RegimeRules = z.infer<typeof regimeRulesSchema>;

export const regimesFileSchema = z
  .strictObject({
    description: z.string(),
    regimes: z.strictObject(
      Object.fromEntries(REGIMES.map((r) => [r, regimeRulesSchema])) as Record<(typeof REGIMES)[number], typeof regimeRulesSchema>,
    ),
  })
  .superRefine((file, ctx) => {
    for (const [regime, rules] of Object.entries(file.regimes)) {
      const codes = new Set<string>();
      for (const group of rules.groups) {
        if (codes.has(group.code)) ctx.addIssue({ code: 'custom', message: `${regime}: group ${group.code} is listed twice.` });
        codes.add(group.code);
        for (const member of group.members) {
          if (!rules.sourceNames[member])
            ctx.addIssue({ code: 'custom', message: `${regime}: ${member} (group ${group.code}) has no printed name.` });
        }
      }
      if (rules.sulphites.group !== null && !codes.has(rules.sulphites.group)) {
        ctx.addIssue({ code: 'custom', message: `${regime}: sulphite group ${rules.sulphites.group} is not a group.` });
      }
    }
  });
export type RegimesFile = z.infer<typeof regimesFileSchema>;

const term = z
  .string()
  .min(1)
  .transform((t) => t.toLowerCase());

export const lexiconFileSchema = z.strictObject({
  description: z.string().min(10),
  negations: z.strictObject({
    before: z.array(term),
    after: z.array(term),
    clauses: z.array(term),
    source: basis,
  }),
  allergenTerms: z.array(z.strictObject({ term, source, species: z.string().min(1).optional(), except: z.array(term).optional() })),
  vagueTerms: z.array(
    z.strictObject({
      term,
      message: z.string().min(1),
      /** The sources the word may stand for: a customer avoiding any of them is not answered from the record. */
      mayMean: z.array(source).min(1),
      /** Claims that cannot be proved while the composition is this vague. */
      unverifies: z.array(z.enum(CLAIMS)).optional(),
      except: z.array(term).optional(),
    }),
  ),
  animalTerms: z.array(
    z.strictObject({
      term,
      fails: z.array(z.enum(['vegan', 'vegetarian'])).optional(),
      unverified: z.array(z.enum(['vegan', 'vegetarian'])).optional(),
      except: z.array(term).optional(),
    }),
  ),
});
export type Lexicon = z.infer<typeof lexiconFileSchema>;

/** Everything the core needs besides the book. */
export interface ReferenceData {
  regimes: RegimesFile['regimes'];
  lexicon: Lexicon;
}

/** Claims that are about allergens (the other two are dietary). */
export type FreeFromClaim = Exclude<(typeof CLAIMS)[number], 'vegan' | 'vegetarian' | 'gluten-free'>;
