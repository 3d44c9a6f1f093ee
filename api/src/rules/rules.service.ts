import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import {
  ALLERGEN_SOURCES,
  SOURCE_LABELS,
  sourceOf,
  type AllergenSource,
  type Book,
  type BookProblem,
  type CompositionScan,
  type CounterRules,
  type ProductDeclaration,
  type Regime,
  type SourceEntry,
} from '@crumbproof/shared';
import { checkBook, declareProduct, ENGINE_VERSION, productDeclarer, scanComposition } from './core';
import type { NutrientTable } from './core/nutrition/nutrient-table';
import type { ReferenceData } from './core/reference-schema';
import { loadNutrientTable } from './nutrients-data';
import { loadReferenceData } from './reference-data';

export type { ProductDeclaration };

/** The rules engine as a Nest provider: reference data is loaded and validated once, at start. */
@Injectable()
export class RulesService {
  readonly refs: ReferenceData = loadReferenceData();
  readonly nutrients: NutrientTable = loadNutrientTable();
  /** Changes whenever the engine or the reference data changes, so kept declarations follow it. */
  readonly referenceVersion = createHash('sha256')
    .update(JSON.stringify([ENGINE_VERSION, this.refs, this.nutrients]))
    .digest('hex')
    .slice(0, 16);

  check(book: Book): BookProblem[] {
    return checkBook(book);
  }

  declare(book: Book, productId: string, regime?: Regime): ProductDeclaration {
    return declareProduct(book, productId, this.refs, { regime });
  }

  /**
   * Declares recipes of one book one at a time, each as `declare` on the recipe's closure gives it,
   * sharing what they have in common (productDeclarer).
   */
  declarer(book: Book, regime?: Regime): (productId: string) => ProductDeclaration {
    return productDeclarer(book, this.refs, { regime });
  }

  /** The terms the engine reads in a supplier's composition text, and where they disagree with the supplier's list. */
  scan(text: string, contains?: SourceEntry[]): CompositionScan {
    const scan = scanComposition(text, this.refs.lexicon);
    const listed = new Set<AllergenSource>((contains ?? []).map(sourceOf));
    const discrepancies =
      contains === undefined
        ? []
        : [...new Map(scan.allergens.filter((h) => !listed.has(h.source)).map((h) => [h.source, h])).values()].map((h) => ({
            source: h.source,
            term: h.matched,
            message: `Composition names '${h.matched}' (${SOURCE_LABELS[h.source]}) but the supplier's list does not include ${SOURCE_LABELS[h.source]}.`,
          }));
    return { ...scan, discrepancies };
  }

  /** What the counter's lookup needs of a regime: its allergen groups with their labels and the sources each covers. */
  counterRules(regime: Regime): CounterRules {
    return { groups: this.refs.regimes[regime].groups.map((g) => ({ code: g.code, label: g.label, sources: g.members })) };
  }

  sources() {
    return ALLERGEN_SOURCES.map((s) => ({ source: s, label: SOURCE_LABELS[s] }));
  }
}
