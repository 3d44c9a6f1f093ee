import { Injectable } from '@nestjs/common';
import {
  declarationChangesInWords,
  diffDeclarations,
  type LabelRunLogItem,
  type RecallPrint,
  type RecallProductNow,
  type RecallResult,
  type ServedDeclaration,
} from '@crumbproof/shared';
import { BooksService } from '../books/books.service';
import { DeclarationsService } from '../declarations/declarations.service';
import { LabelRunsRepository } from '../labels/label-runs.repository';

/** What the print log keeps of each label: the served declaration it was rendered from (LabelsService's PrintSource). */
interface PrintedFrom {
  declaration: ServedDeclaration;
}

/**
 * The starting point of a recall: from a batch code as printed, every print of it with the
 * declaration it carried (as the print log keeps it), and what has changed in each product since.
 */
@Injectable()
export class RecallService {
  constructor(
    private readonly runs: LabelRunsRepository,
    private readonly books: BooksService,
    private readonly declarations: DeclarationsService,
  ) {}

  async fromBatch(batch: string): Promise<RecallResult> {
    const state = await this.books.state();
    const found = await this.runs.printsOfBatch<LabelRunLogItem, PrintedFrom>(state.site.id, batch);
    const prints: RecallPrint[] = found.flatMap(({ run, line, position, source }) =>
      source
        ? [
            {
              run: run.id,
              printedAt: run.printedAt.toISOString(),
              printedBy: run.printedByName,
              template: run.template,
              productionDate: run.productionDate,
              product: line.productCode,
              productName: run.items[position]?.name ?? source.declaration.name,
              revision: line.revision,
              quantity: line.quantity,
              date: line.date,
              declaration: source.declaration,
            },
          ]
        : [],
    );
    if (prints.length === 0) return { batch, prints: [], products: [], message: `No print of batch ${batch}.` };

    const products: RecallProductNow[] = [];
    for (const code of [...new Set(prints.map((p) => p.product))]) {
      const printed = prints.find((p) => p.product === code)!;
      const recipe = state.book.recipes.find((r) => r.id === code);
      if (!recipe) {
        products.push({
          product: code,
          name: printed.productName,
          revision: null,
          declaration: null,
          diff: null,
          changes: [`${printed.productName} is no longer in the kitchen’s records.`],
        });
        continue;
      }
      const now = await this.declarations.forProduct(code, printed.declaration.basis.regime, state);
      const diff = diffDeclarations(printed.declaration, now);
      products.push({
        product: code,
        name: recipe.name,
        revision: state.heads.get(code)?.revision ?? null,
        declaration: now,
        diff,
        changes: declarationChangesInWords(diff, { before: printed.declaration.ingredientsText, after: now.ingredientsText }),
      });
    }
    const units = prints.reduce((n, p) => n + p.quantity, 0);
    const runs = new Set(prints.map((p) => p.run)).size;
    const message =
      `Batch ${batch}: ${units} label${units === 1 ? '' : 's'} in ${runs} print run${runs === 1 ? '' : 's'}. ` +
      (products.some((p) => p.changes.length > 0)
        ? 'The product has changed since it was printed: read what changed before deciding on a recall.'
        : 'Nothing a label shows has changed since it was printed.');
    return { batch, prints, products, message };
  }
}
