/**
 * The pure rules engine: plain functions over the recipe book and the reference data.
 * No framework, no database, no I/O (reference data is passed in).
 */
export { checkBook } from './book-check';
export { declare, declareAll, redeclareAfterChange, type DeclareOptions } from './declare';
export { BookProblemsError, UnknownProductError, UnknownSiteError } from './errors';
export { declareAtSite, declareSite, declareSiteEach, siteView, sitesOf, standInsOf, type SiteView } from './site-view';
export { scanComposition } from './composition-scan';
export { buildTree, leavesOf, type ProductTree, type TreeNode } from './tree';
export { bookJsonSchema, bookJsonSchemaText } from './book-schema';
export { defaultMeasures, toGrams } from './quantities';
export {
  lexiconFileSchema,
  regimesFileSchema,
  type Lexicon,
  type ReferenceData,
  type RegimeRules,
  type RegimesFile,
} from './reference-schema';
export { declareEach, declareProduct, declareProducts, productDeclarer, ENGINE_VERSION } from './product';
