import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import type { Book, BookProblem, Declaration, Regime } from '@crumbproof/shared';
import { checkBook, declare } from './core';
import type { ReferenceData } from './core/reference-schema';
import { loadReferenceData } from './reference-data';

/** The rules engine as a Nest provider: reference data is loaded and validated once, at start. */
@Injectable()
export class RulesService {
  readonly refs: ReferenceData = loadReferenceData();
  /** Changes whenever the reference data changes, so cached declarations follow it. */
  readonly referenceVersion = createHash('sha256').update(JSON.stringify(this.refs)).digest('hex').slice(0, 16);

  check(book: Book): BookProblem[] {
    return checkBook(book);
  }

  declare(book: Book, productId: string, regime?: Regime): Declaration {
    return declare(book, productId, this.refs, { regime });
  }
}
