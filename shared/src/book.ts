import { z } from 'zod';
import {
  ALLERGEN_SOURCES,
  CLAIMS,
  LINE_ROLES,
  MEASURE_SYSTEMS,
  REGIMES,
  UNITS,
  allergenSourceSchema,
  exemptFormSchema,
  notInListMessage,
} from './allergens';
import { handlingSchema } from './kitchen';

/**
 * The recipe book: one JSON document holding a whole kitchen. It is the import, export and
 * backup format, and the input of the rules engine. Its JSON Schema is published as
 * reference-data/book.schema.json (generated from this file; a test keeps them equal).
 */
const id = z.string().trim().min(1, 'An id cannot be empty.').max(80, 'Use an id of at most 80 characters.');

const sourceObjectSchema = z.strictObject(
  {
    source: allergenSourceSchema,
    form: exemptFormSchema.optional(),
    species: z
      .string({ error: 'Write the species as text, such as "cod".' })
      .trim()
      .min(1, 'Give the species, or leave it out.')
      .max(60, 'Keep the species to 60 characters or fewer.')
      .optional(),
  },
  {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `An allergen entry has only source, form and species; remove ${issue.keys.join(', ')}.`
        : undefined,
  },
);

/**
 * An allergen entry: a source name ("milk"), or an object naming its form or species. A refused
 * entry says which value is unknown and lists the accepted ones (the union's own message: for
 * an object, the first of its own issues; for anything else, the allergen source's).
 */
export const sourceEntrySchema = z.union([allergenSourceSchema, sourceObjectSchema], {
  error: (issue) => {
    if (issue.code !== 'invalid_union') return undefined;
    const input = issue.input;
    if (input !== null && typeof input === 'object' && !Array.isArray(input)) return issue.errors[1]?.[0]?.message;
    if (typeof input === 'string') return notInListMessage('allergen source', input, ALLERGEN_SOURCES);
    return `Write each allergen as a source (one of: ${ALLERGEN_SOURCES.join(', ')}) or as {"source", "form", "species"}.`;
  },
});
export type SourceEntry = z.infer<typeof sourceEntrySchema>;

/** Nutrition per 100 g as eaten raw, in grams (cholesterol in mg). A key left out is not known. */
export const nutritionSchema = z.strictObject({
  energyKj: z.number().min(0).optional(),
  energyKcal: z.number().min(0).optional(),
  fat: z.number().min(0).max(100).optional(),
  saturates: z.number().min(0).max(100).optional(),
  transFat: z.number().min(0).max(100).optional(),
  cholesterolMg: z.number().min(0).max(100000).optional(),
  carbohydrate: z.number().min(0).max(100).optional(),
  sugars: z.number().min(0).max(100).optional(),
  addedSugars: z.number().min(0).max(100).optional(),
  polyols: z.number().min(0).max(100).optional(),
  erythritol: z.number().min(0).max(100).optional(),
  fibre: z.number().min(0).max(100).optional(),
  protein: z.number().min(0).max(100).optional(),
  salt: z.number().min(0).max(100).optional(),
  sodium: z.number().min(0).max(100).optional(),
  alcohol: z.number().min(0).max(100).optional(),
  organicAcids: z.number().min(0).max(100).optional(),
  salatrims: z.number().min(0).max(100).optional(),
  source: z.string().max(300).optional(),
});
export type Nutrition = z.infer<typeof nutritionSchema>;

export const bookIngredientSchema = z.strictObject({
  id,
  name: z.string().trim().min(1, 'Give the ingredient a name.').max(160),
  supplier: z.string().trim().max(160).optional(),
  supplierCode: z.string().trim().max(80).optional(),
  /** Left out: the supplier gave no allergen statement (unknown). Empty: verified none. */
  contains: z.array(sourceEntrySchema).optional(),
  mayContain: z.array(sourceEntrySchema).default([]),
  composition: z.string().max(4000).optional(),
  vegan: z.boolean({ error: 'Say whether it is vegan: true, false, or null when it is not known.' }).nullable(),
  vegetarian: z.boolean({ error: 'Say whether it is vegetarian: true, false, or null when it is not known.' }).nullable(),
  sulphiteMgPerKg: z.number().min(0).max(100000).optional(),
  /** Gluten measured or specified by the supplier, mg/kg. */
  glutenMgPerKg: z.number().min(0).max(1000000).optional(),
  gPerMl: z.number().positive().max(5).optional(),
  gEach: z.number().positive().max(100000).optional(),
  /**
   * This ingredient is added water (EU 1169/2011 Annex VII A.1). The engine also recognises
   * an ingredient whose id or name is 'water'.
   */
  isWater: z.boolean().optional(),
  /** Sugars in this ingredient count as added sugars (US). */
  addsSugars: z.boolean().optional(),
  nutrition: nutritionSchema.optional(),
});
export type BookIngredient = z.infer<typeof bookIngredientSchema>;

export const recipeLineSchema = z.strictObject({
  use: id,
  qty: z
    .number({ error: 'Give a quantity above zero.' })
    .positive('Give a quantity above zero.')
    .max(1_000_000, 'Use a quantity no larger than 1000000.'),
  unit: z.enum(UNITS),
  role: z.enum(LINE_ROLES).optional(),
});
export type RecipeLine = z.infer<typeof recipeLineSchema>;

export const saleSchema = z.strictObject({
  portionG: z
    .number({ error: 'Give the weight of one portion in grams.' })
    .positive('Give a portion weight above zero.')
    .max(100000, 'Use a portion weight no larger than 100000 g.'),
  claims: z.array(z.enum(CLAIMS)).optional(),
  quid: z.array(id).optional(),
});
export type Sale = z.infer<typeof saleSchema>;

export const bookRecipeSchema = z.strictObject({
  id,
  name: z.string().trim().min(1, 'Give the recipe a name.').max(160),
  lines: z.array(recipeLineSchema).min(1, 'A recipe needs at least one line.'),
  finishedWeightG: z.number().positive().max(10_000_000).optional(),
  sale: saleSchema.optional(),
});
export type BookRecipe = z.infer<typeof bookRecipeSchema>;

export const siteSchema = z.strictObject({
  name: z.string().trim().min(1).max(160),
  regime: z.enum(REGIMES),
  measures: z.enum(MEASURE_SYSTEMS).optional(),
  handles: z.array(handlingSchema).default([]),
});
export type Site = z.infer<typeof siteSchema>;

export const bookSchema = z.strictObject({
  crumbproofBook: z.literal(1, { error: 'This is not a Crumbproof recipe book of a known version: crumbproofBook must be 1.' }),
  site: siteSchema,
  ingredients: z.array(bookIngredientSchema),
  recipes: z.array(bookRecipeSchema),
});
export type Book = z.infer<typeof bookSchema>;
export type BookInput = z.input<typeof bookSchema>;
