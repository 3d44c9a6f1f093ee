import { z } from 'zod';
import {
  ALLERGEN_SOURCES,
  CLAIMS,
  LINE_ROLES,
  MEASURE_SYSTEMS,
  REGIMES,
  UNITS,
  allergenSourceSchema,
  type Unit,
  exemptFormSchema,
  notInListMessage,
} from './allergens';
import { handlingSchema } from './kitchen';
import { type Gs1KeyKind, verifyGs1Key } from './gs1';
import { oneLine, plainText } from './text';

/**
 * The recipe book: one JSON document holding a whole kitchen. It is the import, export and
 * backup format, and the input of the rules engine. Its JSON Schema is published as
 * reference-data/book.schema.json (generated from this file; a test keeps them equal).
 */

/** The longest id: the code columns of ingredients and recipes hold 80 characters. */
export const ID_MAX_LENGTH = 80;

/**
 * One way to write an id: lower-case ASCII letters, digits and hyphens, starting with a letter or
 * digit. Ids are compared exactly (by the rules engine, the write path and the database alike),
 * so 'SP-CASE' or 'sp-cäse' are never taken for 'sp-case': they are refused as ids.
 */
export const ID_PATTERN = /^[a-z0-9][a-z0-9-]*$/;

/** Text written as an id: "Crème Pâtissière (Vanilla)" → "creme-patissiere-vanilla"; '' when nothing is left. */
export function canonicalId(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .toLowerCase()
    .replace(/&/g, ' and ')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+/, '')
    .slice(0, ID_MAX_LENGTH)
    .replace(/-+$/, '');
}

/** What to do about a text that is not an id, with the id it would be. */
export function idMessage(text: unknown): string {
  const suggestion = (typeof text === 'string' ? canonicalId(text) : '') || 'plain-flour';
  if (typeof text === 'string' && /^-+[a-z0-9-]*$/.test(text)) return `Start the id with a letter or digit, e.g. '${suggestion}'.`;
  return `Use lower-case letters, digits and hyphens, e.g. '${suggestion}'.`;
}

/** The smallest quantity a line can weigh: a milligram, what a precision kitchen scale reads (common practice). */
export const MIN_GRAMS = 0.001;

/** An id of an ingredient or recipe, written the one canonical way; `whenEmpty` says what to do when none is given. */
export function itemId(whenEmpty = 'An id cannot be empty.') {
  return z
    .string()
    .min(1, { error: whenEmpty, abort: true })
    .max(ID_MAX_LENGTH, `Use an id of at most ${ID_MAX_LENGTH} characters.`)
    .regex(ID_PATTERN, { error: (issue) => idMessage(issue.input) });
}
export const itemIdSchema = itemId();
const id = itemIdSchema;

const sourceObjectSchema = z.strictObject(
  {
    source: allergenSourceSchema,
    form: exemptFormSchema.optional(),
    species: oneLine(
      z
        .string({ error: 'Write the species as text, such as "cod".' })
        .trim()
        .min(1, 'Give the species, or leave it out.')
        .max(60, 'Keep the species to 60 characters or fewer.'),
    ).optional(),
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

/**
 * The most energy 100 g can hold: pure fat, the most energy-dense nutrient, gives 37 kJ (9 kcal)
 * per gram (Regulation (EU) No 1169/2011 Annex XIV), so 3700 kJ or 900 kcal per 100 g.
 */
export const MAX_ENERGY_KJ_PER_100G = 3700;
export const MAX_ENERGY_KCAL_PER_100G = 900;

/** The nutrients that are separate parts of the food's mass: together they cannot weigh more than the 100 g they are in. */
const MASS_PARTS = ['fat', 'carbohydrate', 'protein', 'fibre', 'salt'] as const;

/** A mass per 100 g: from 0 to the 100 g it is part of. */
const gramsPer100g = () => z.number().min(0).max(100);

/** Nutrition per 100 g as eaten raw, in grams (cholesterol in mg). A key left out is not known. */
export const nutritionSchema = z
  .strictObject({
    energyKj: z
      .number()
      .min(0)
      .max(
        MAX_ENERGY_KJ_PER_100G,
        `Use at most ${MAX_ENERGY_KJ_PER_100G} kJ per 100 g: even pure fat gives no more (37 kJ per gram, Regulation (EU) No 1169/2011 Annex XIV).`,
      )
      .optional(),
    energyKcal: z
      .number()
      .min(0)
      .max(
        MAX_ENERGY_KCAL_PER_100G,
        `Use at most ${MAX_ENERGY_KCAL_PER_100G} kcal per 100 g: even pure fat gives no more (9 kcal per gram, Regulation (EU) No 1169/2011 Annex XIV).`,
      )
      .optional(),
    fat: gramsPer100g().optional(),
    saturates: gramsPer100g().optional(),
    transFat: gramsPer100g().optional(),
    /** 100000 mg is the whole 100 g. */
    cholesterolMg: z.number().min(0).max(100000, 'Use at most 100000 mg per 100 g: that is the whole 100 g.').optional(),
    carbohydrate: gramsPer100g().optional(),
    sugars: gramsPer100g().optional(),
    addedSugars: gramsPer100g().optional(),
    polyols: gramsPer100g().optional(),
    erythritol: gramsPer100g().optional(),
    fibre: gramsPer100g().optional(),
    protein: gramsPer100g().optional(),
    salt: gramsPer100g().optional(),
    sodium: gramsPer100g().optional(),
    alcohol: gramsPer100g().optional(),
    organicAcids: gramsPer100g().optional(),
    salatrims: gramsPer100g().optional(),
    source: oneLine(z.string().max(300)).optional(),
  })
  .superRefine((n, ctx) => {
    const given = MASS_PARTS.filter((k) => n[k] !== undefined);
    // A part over 100 g on its own has its own message already.
    if (given.some((k) => n[k]! > 100)) return;
    const total = given.reduce((sum, k) => sum + n[k]!, 0);
    // A millionth of a gram of slack, so that decimal figures adding up to exactly 100 are not refused.
    const last = given.at(-1);
    if (last !== undefined && total > 100 + 1e-6) {
      ctx.addIssue({
        code: 'custom',
        path: [last],
        input: total,
        message: `${given.slice(0, -1).join(', ')} and ${last} add up to ${Math.round(total * 1000) / 1000} g, more than the 100 g they are part of; check the figures.`,
      });
    }
  });
export type Nutrition = z.infer<typeof nutritionSchema>;

export const bookIngredientSchema = z.strictObject({
  id,
  name: oneLine(z.string().trim().min(1, 'Give the ingredient a name.').max(160)),
  supplier: oneLine(z.string().trim().max(160)).optional(),
  supplierCode: oneLine(z.string().trim().max(80)).optional(),
  /** Left out: the supplier gave no allergen statement (unknown). Empty: verified none. */
  contains: z.array(sourceEntrySchema).optional(),
  mayContain: z.array(sourceEntrySchema).default([]),
  composition: plainText(z.string().max(4000)).optional(),
  vegan: z.boolean({ error: 'Say whether it is vegan: true, false, or null when it is not known.' }).nullable(),
  vegetarian: z.boolean({ error: 'Say whether it is vegetarian: true, false, or null when it is not known.' }).nullable(),
  sulphiteMgPerKg: z.number().min(0).max(100000).optional(),
  /** Gluten measured or specified by the supplier, mg/kg. */
  glutenMgPerKg: z.number().min(0).max(1000000).optional(),
  /** From 0.01 g per ml (a puffed cereal measured by the cup) to 5 (no food is denser; common practice). */
  gPerMl: z
    .number()
    .positive({ abort: true })
    .min(0.01, 'Use at least 0.01 g per ml: nothing measured in a kitchen is lighter.')
    .max(5, 'Use at most 5 g per ml: no food is that dense.')
    .optional(),
  /** From a milligram (the smallest quantity a line can weigh) to 100 kg. */
  gEach: z
    .number()
    .positive({ abort: true })
    .min(MIN_GRAMS, `Give a weight for one of at least ${MIN_GRAMS} g (1 mg).`)
    .max(100000, 'Use at most 100000 g (100 kg) for one.')
    .optional(),
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

/**
 * What one recipe line can hold, per unit: from a milligram or a microlitre (a thousandth of a
 * spoon, cup or item) up to a tonne or 1000 litres (200000 teaspoons of 5 ml, 50000 tablespoons of
 * up to 20 ml, 4000 cups of 250 ml; 100000 items). Common practice: no kitchen line is outside them.
 */
export const QUANTITY_LIMITS: Record<Unit, { min: number; max: number }> = {
  g: { min: MIN_GRAMS, max: 1_000_000 },
  kg: { min: 0.000001, max: 1_000 },
  ml: { min: 0.001, max: 1_000_000 },
  l: { min: 0.000001, max: 1_000 },
  tsp: { min: 0.001, max: 200_000 },
  tbsp: { min: 0.001, max: 50_000 },
  cup: { min: 0.001, max: 4_000 },
  each: { min: 0.001, max: 100_000 },
};

/**
 * One line of a recipe. A line used in the mix has a quantity and a unit. A contact line (a
 * floured tin, a greased board) brings its allergens but no weight: it needs neither, and a
 * quantity given to one never counts toward the mix, the percentages or the nutrition.
 */
/** A line's quantity: above zero. The editor checks each keystroke against this same schema. */
export const lineQtySchema = z
  .number({ error: 'Give a quantity above zero.' })
  .positive('Give a quantity above zero.')
  .max(1_000_000, 'Use a quantity no larger than 1000000.');

export const recipeLineSchema = z
  .strictObject({
    use: id,
    qty: lineQtySchema.optional(),
    unit: z.enum(UNITS).optional(),
    role: z.enum(LINE_ROLES).optional(),
  })
  .meta({
    description:
      'A line of a recipe. qty and unit are required unless role is "contact": a contact line brings its allergens but no weight, and a quantity given to one never counts.',
  })
  .superRefine((line, ctx) => {
    if (line.role !== 'contact') {
      if (line.qty === undefined) ctx.addIssue({ code: 'custom', path: ['qty'], message: 'Give a quantity above zero.' });
      if (line.unit === undefined) ctx.addIssue({ code: 'custom', path: ['unit'], message: `Give a unit: one of ${UNITS.join(', ')}.` });
    }
    if (line.qty === undefined || line.unit === undefined) return;
    const limits = QUANTITY_LIMITS[line.unit];
    if (!limits || !(line.qty > 0)) return;
    if (line.qty < limits.min)
      ctx.addIssue({
        code: 'custom',
        path: ['qty'],
        input: line.qty,
        message: `Use at least ${limits.min} ${line.unit}: a smaller quantity cannot be weighed or measured.`,
      });
    else if (line.qty > limits.max)
      ctx.addIssue({
        code: 'custom',
        path: ['qty'],
        input: line.qty,
        message: `Use at most ${limits.max} ${line.unit} in one line.`,
      });
  });
export type RecipeLine = z.infer<typeof recipeLineSchema>;
/** A line that counts toward the mix: not a contact line, with its quantity and unit. */
export type WeighedLine = RecipeLine & { qty: number; unit: Unit };
/** Whether a line counts toward the mix (a contact line never does, whatever it is given). */
export const isWeighed = (line: RecipeLine): line is WeighedLine =>
  line.role !== 'contact' && line.qty !== undefined && line.unit !== undefined;

/** How a date is marked on a label: a best before date (quality) or a use by date (safety), Regulation (EU) No 1169/2011 Article 24 and Annex X. */
export const DATE_MARKS = ['best-before', 'use-by'] as const;
export type DateMark = (typeof DATE_MARKS)[number];

/** A GS1 key as text, its length and check digit verified (the message names the expected digit). */
export function gs1KeySchema(kind: Gs1KeyKind, whenNotText: string) {
  return z.string({ error: whenNotText }).superRefine((value, ctx) => {
    const problem = verifyGs1Key(value, kind);
    if (problem) ctx.addIssue({ code: 'custom', input: value, message: problem });
  });
}

/** The units in one case of a product sold to the trade. */
export const unitsPerCaseSchema = z
  .number({ error: 'Give the units per case as a whole number.' })
  .int('Give the units per case as a whole number.')
  .min(1, 'A case holds at least 1 unit.')
  .max(9999, 'Use at most 9999 units per case.');

/**
 * What a label of the product prints besides its declaration. Every field is optional: a book
 * without them reads as before, and a label that needs a missing one is refused by the renderer.
 */
const salePrintDetailsShape = {
  /** Days from the production date to the date on the label: from 1 day to 10 years. */
  shelfLifeDays: z
    .number({ error: 'Give the shelf life as a whole number of days.' })
    .int('Give the shelf life as a whole number of days.')
    .min(1, 'Give a shelf life of at least 1 day.')
    .max(3650, 'Use a shelf life of at most 3650 days (10 years).')
    .optional(),
  dateMark: z.enum(DATE_MARKS, { error: (issue) => notInListMessage('date mark', issue.input, DATE_MARKS) }).optional(),
  /** The unit's GTIN (GTIN-8, -12 or -13), check digit verified. */
  gtin: gs1KeySchema('unit-gtin', 'Write the GTIN as digits.').optional(),
  /** The GTIN-14 of the case the product is sold in to the trade, check digit verified. */
  caseGtin: gs1KeySchema('gtin-14', 'Write the case GTIN-14 as digits.').optional(),
  unitsPerCase: unitsPerCaseSchema.optional(),
  /** The net weight of one unit in grams, as printed on the label. */
  netWeightG: z
    .number({ error: 'Give the net weight in grams.' })
    .positive('Give a net weight above zero.')
    .max(1_000_000, 'Use a net weight of at most 1000000 g (1 tonne).')
    .optional(),
  /** One line of storage conditions, e.g. "Keep refrigerated at 0–5 °C". */
  storage: oneLine(
    z
      .string()
      .trim()
      .min(1, 'Write the storage conditions, or leave them out.')
      .max(200, 'Keep the storage conditions to 200 characters or fewer.'),
  ).optional(),
};

export const saleSchema = z
  .strictObject({
    portionG: z
      .number({ error: 'Give the weight of one portion in grams.' })
      .min(MIN_GRAMS, `Give a portion weight above zero: at least ${MIN_GRAMS} g (1 mg).`)
      .max(100000, 'Use a portion weight no larger than 100000 g.'),
    claims: z.array(z.enum(CLAIMS)).optional(),
    quid: z.array(id).optional(),
    ...salePrintDetailsShape,
    /**
     * Shown on the kitchen's public product page (when the kitchen has it on), and its counter
     * ticket carries a QR code to it. Left out: not published.
     */
    published: z.boolean({ error: 'Say whether the product is published on the public page (true or false).' }).optional(),
  })
  .superRefine((sale, ctx) => {
    // A date on the label needs both: how long the product keeps, and what kind of date it is.
    if (sale.dateMark !== undefined && sale.shelfLifeDays === undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['shelfLifeDays'],
        input: undefined,
        message: 'Give the shelf life in days for the date mark.',
      });
    if (sale.shelfLifeDays !== undefined && sale.dateMark === undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['dateMark'],
        input: undefined,
        message: "Say whether the date is a best before date or a use by date ('best-before' or 'use-by').",
      });
  });
export type Sale = z.infer<typeof saleSchema>;

export const bookRecipeSchema = z.strictObject({
  id,
  name: oneLine(z.string().trim().min(1, 'Give the recipe a name.').max(160)),
  lines: z.array(recipeLineSchema).min(1, 'A recipe needs at least one line.'),
  /** What the batch weighs when made (after baking): from a milligram to 10 tonnes. */
  finishedWeightG: z
    .number()
    .min(MIN_GRAMS, `Give a finished weight above zero: at least ${MIN_GRAMS} g (1 mg).`)
    .max(10_000_000, 'Use a finished weight no larger than 10000000 g.')
    .optional(),
  sale: saleSchema.optional(),
});
export type BookRecipe = z.infer<typeof bookRecipeSchema>;

export const siteSchema = z.strictObject({
  name: oneLine(z.string().trim().min(1).max(160)),
  /** The business's postal address, printed with its name on pre-packed labels. */
  address: oneLine(z.string().trim().max(300)).optional(),
  regime: z.enum(REGIMES),
  measures: z.enum(MEASURE_SYSTEMS).optional(),
  handles: z.array(handlingSchema).default([]),
});
export type Site = z.infer<typeof siteSchema>;

/**
 * The one-site book the rules engine declares, the API holds and exports: a kitchen (`site`),
 * its ingredients and its recipes. A book of several sites reads through `bookFileSchema`, and
 * each site's view of it is a book of this shape (`siteView` in the rules core).
 */
export const bookSchema = z.strictObject({
  crumbproofBook: z.literal(1, { error: 'This is not a Crumbproof recipe book of a known version: crumbproofBook must be 1.' }),
  site: siteSchema,
  ingredients: z.array(bookIngredientSchema),
  recipes: z.array(bookRecipeSchema),
});
export type Book = z.infer<typeof bookSchema>;
export type BookInput = z.input<typeof bookSchema>;

/** A site's id, written as an ingredient's or recipe's is (lower-case letters, digits and hyphens). */
/** Kept for the public page's own files (`/p/fonts/…`), so no kitchen's page address can reach them. */
export const RESERVED_SITE_IDS = ['fonts'] as const;

export const siteIdSchema = itemId("Give the site an id, e.g. 'high-street'.").refine(
  (v) => !(RESERVED_SITE_IDS as readonly string[]).includes(v),
  { error: (issue) => `'${String(issue.input)}' is kept for the public page's own files; give the site another id.` },
);

/**
 * A site's own ingredient standing in for one of the book's shared ingredients, in that site only:
 * every recipe line of the shared one is made with the site's own there.
 */
export const substitutionSchema = z.strictObject({
  /** The shared ingredient replaced (it has no onlyAt). */
  replaces: id,
  /** The site's own ingredient used instead (its onlyAt is this site). */
  with: id,
  /** Why, in a line: "Flour from the mill down the road". */
  note: oneLine(
    z.string().trim().min(1, 'Write the note, or leave it out.').max(300, 'Keep the note to 300 characters or fewer.'),
  ).optional(),
});
export type Substitution = z.infer<typeof substitutionSchema>;

/** One kitchen of a book of several: the site's fields with its id, its substitutions and what it sells. */
export const bookSiteSchema = z.strictObject({
  id: siteIdSchema,
  ...siteSchema.shape,
  substitutions: z.array(substitutionSchema).optional(),
  /** The recipes for sale at this site (each has sale details). Left out: every recipe for sale in the book. */
  sells: z.array(id).optional(),
});
export type BookSite = z.infer<typeof bookSiteSchema>;

/** An ingredient of the book file: shared by every site, or a site's own (`onlyAt`, its id). */
export const bookFileIngredientSchema = bookIngredientSchema.extend({
  /** The site that keeps this ingredient; it stands in for a shared one there by a substitution on the site, never elsewhere. */
  onlyAt: siteIdSchema.optional(),
});
export type BookFileIngredient = z.infer<typeof bookFileIngredientSchema>;

/**
 * The recipe book file (import, export, backup, and the commands' input): one kitchen as `site`,
 * or several as `sites` (exactly one of the two). Ingredients and recipes belong to the
 * book and are shared by its sites. Every reference between sites, substitutions, sold recipes
 * and site-own ingredients is checked here, each refusal naming where it is.
 */
export const bookFileSchema = z
  .strictObject({
    crumbproofBook: bookSchema.shape.crumbproofBook,
    site: siteSchema.optional(),
    sites: z.array(bookSiteSchema).min(1, 'Give at least one site, or give the one kitchen as site.').optional(),
    ingredients: z.array(bookFileIngredientSchema),
    recipes: z.array(bookRecipeSchema),
  })
  // Only over a book whose every part is valid: the references are read from it.
  .superRefine(
    (book, ctx) => {
      for (const issue of siteIssues(book)) ctx.addIssue({ code: 'custom', input: undefined, ...issue });
    },
    { when: (payload) => payload.issues.length === 0 },
  )
  .meta({ oneOf: [{ required: ['site'] }, { required: ['sites'] }] });
export type BookFile = z.infer<typeof bookFileSchema>;
export type BookFileInput = z.input<typeof bookFileSchema>;

interface SiteIssue {
  path: (string | number)[];
  message: string;
}

/** What the book's sites, site-own ingredients, substitutions and sold recipes name that does not hold. */
function siteIssues(book: Omit<BookFile, 'crumbproofBook'>): SiteIssue[] {
  if (book.site && book.sites)
    return [{ path: ['sites'], message: 'Give the kitchen either as site (one kitchen) or as sites (several), not both.' }];
  if (!book.site && !book.sites)
    return [{ path: ['site'], message: 'Give the kitchen as site (one kitchen), or the kitchens as sites (several, each with its id).' }];
  const issues: SiteIssue[] = [];
  const sites = book.sites ?? [];
  const siteById = new Map<string, BookSite>();
  sites.forEach((site, i) => {
    if (siteById.has(site.id))
      issues.push({ path: ['sites', i, 'id'], message: `The site id '${site.id}' is used by two sites; give each site its own id.` });
    else siteById.set(site.id, site);
  });
  // Every other reference names a site by its id, so it is read only once each id is one site's.
  if (issues.length > 0) return issues;
  const known = sites.map((s) => s.id).join(', ');
  const ingredients = new Map(book.ingredients.map((x) => [x.id, x]));
  const recipes = new Map(book.recipes.map((r) => [r.id, r]));
  const siteName = (siteId: string) => siteById.get(siteId)?.name ?? siteId;
  const ownedBy = (ingredient: BookFileIngredient) =>
    `${ingredient.name} is kept only at ${siteName(ingredient.onlyAt!)} (onlyAt '${ingredient.onlyAt}')`;

  book.ingredients.forEach((ingredient, i) => {
    if (ingredient.onlyAt === undefined) return;
    if (book.site)
      issues.push({
        path: ['ingredients', i, 'onlyAt'],
        message: `onlyAt names a site, and this book's one kitchen (site) has no id: give the book its kitchens as sites, each with its id, or leave onlyAt out.`,
      });
    else if (!siteById.has(ingredient.onlyAt))
      issues.push({
        path: ['ingredients', i, 'onlyAt'],
        message: `'${ingredient.onlyAt}' is not a site of this book; its sites are ${known}.`,
      });
  });

  // Recipes are shared by every site, so they name shared ingredients only; a site's own comes in by its substitution.
  const sharedOnly = (use: string) => {
    const ingredient = ingredients.get(use);
    return ingredient?.onlyAt !== undefined && siteById.has(ingredient.onlyAt)
      ? `${ownedBy(ingredient)}, and the book's recipes are shared by every site: name the shared ingredient here, and record a substitution on ${siteName(ingredient.onlyAt)} replacing it with '${use}'.`
      : undefined;
  };
  book.recipes.forEach((recipe, r) => {
    recipe.lines.forEach((line, l) => {
      const message = sharedOnly(line.use);
      if (message) issues.push({ path: ['recipes', r, 'lines', l, 'use'], message: `Line ${l + 1} of ${recipe.name}: ${message}` });
    });
    recipe.sale?.quid?.forEach((named, q) => {
      const message = sharedOnly(named);
      if (message) issues.push({ path: ['recipes', r, 'sale', 'quid', q], message: `The QUID of ${recipe.name}: ${message}` });
    });
  });

  sites.forEach((site, s) => {
    const replaced = new Map<string, number>();
    site.substitutions?.forEach((sub, n) => {
      const at = (field: 'replaces' | 'with', message: string) => issues.push({ path: ['sites', s, 'substitutions', n, field], message });
      const notAnIngredient = (use: string) =>
        recipes.has(use)
          ? `'${use}' is a recipe; a substitution puts one ingredient in the place of another.`
          : `'${use}' is not an ingredient of this book.`;
      const shared = ingredients.get(sub.replaces);
      if (!shared) at('replaces', notAnIngredient(sub.replaces));
      else if (shared.onlyAt !== undefined)
        at('replaces', `${ownedBy(shared)}: a substitution replaces one of the book's shared ingredients.`);
      else if (replaced.has(sub.replaces))
        at(
          'replaces',
          `${shared.name} is already replaced by substitution ${replaced.get(sub.replaces)! + 1} of this site; replace each ingredient once.`,
        );
      else replaced.set(sub.replaces, n);

      const own = ingredients.get(sub.with);
      if (!own) at('with', notAnIngredient(sub.with));
      else if (own.onlyAt === undefined)
        at(
          'with',
          `${own.name} is a shared ingredient: what stands in at a site is that site's own ingredient (give it onlyAt '${site.id}' if only this site keeps it).`,
        );
      else if (own.onlyAt !== site.id && siteById.has(own.onlyAt))
        at('with', `${ownedBy(own)}, not at ${site.name}: a site stands in only its own ingredients.`);
    });

    const listed = new Set<string>();
    site.sells?.forEach((sold, n) => {
      const at = (message: string) => issues.push({ path: ['sites', s, 'sells', n], message });
      const recipe = recipes.get(sold);
      if (!recipe)
        at(ingredients.has(sold) ? `'${sold}' is an ingredient; a site sells recipes.` : `'${sold}' is not a recipe of this book.`);
      else if (!recipe.sale)
        at(`${recipe.name} is not for sale in this book (it has no sale details): give it sale details, or leave it out of sells.`);
      else if (listed.has(sold)) at(`${recipe.name} is listed twice; list each recipe once.`);
      listed.add(sold);
    });
  });
  return issues;
}
