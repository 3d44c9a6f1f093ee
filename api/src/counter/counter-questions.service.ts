import { Injectable } from '@nestjs/common';
import {
  ALLERGEN_SOURCES,
  notInListMessage,
  type CounterAnswerRequest,
  type CounterQuestionRequest,
  type CounterQuestionView,
  type FieldError,
} from '@crumbproof/shared';
import { BooksService } from '../books/books.service';
import { AuditService } from '../audit/audit.service';
import { AppError } from '../common/app-error';
import type { AuthUser } from '../common/current-user.decorator';
import { TransactionRunner } from '../common/transaction';
import { KitchenService } from '../kitchen/kitchen.service';
import { RulesService } from '../rules/rules.service';
import { CounterChannel } from './counter-channel';
import { CounterQuestionsRepository, type CounterQuestionRow } from './counter-questions.repository';
import { notForSale } from './product-for-sale';

/** Questions front of house asks the kitchen about a product, and the kitchen's answers. */
@Injectable()
export class CounterQuestionsService {
  constructor(
    private readonly repo: CounterQuestionsRepository,
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly rules: RulesService,
    private readonly channel: CounterChannel,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
  ) {}

  /**
   * Records a question with who asked it and when. The product must be one for sale, and each
   * allergen a group of the kitchen's regime or a source; nothing is recorded when one is not.
   */
  async ask(body: CounterQuestionRequest, user: AuthUser): Promise<CounterQuestionView> {
    const { site, book } = await this.books.state();
    const fields: FieldError[] = [];
    const problem = notForSale(book, body.product);
    if (problem) fields.push({ path: 'product', message: problem });
    const product = book.recipes.find((r) => r.id === body.product);
    const accepted = [...this.rules.refs.regimes[site.regime].groups.map((g) => g.code), ...ALLERGEN_SOURCES];
    body.avoid.forEach((code, i) => {
      if (!accepted.includes(code)) fields.push({ path: `avoid.${i}`, message: notInListMessage('allergen', code, accepted) });
    });
    if (fields.length > 0 || !product) throw new AppError('validation', fields.map((f) => `${f.path}: ${f.message}`).join(' '), fields);
    const row = await this.tx.run(async (t) => {
      const added = await this.repo.add(
        site.id,
        {
          productCode: product.id,
          productName: product.name,
          avoid: body.avoid,
          note: body.note ? body.note : null,
          askedBy: user.id,
          askedByName: user.name,
        },
        t,
      );
      await this.audit.record(
        {
          action: 'counter.question-asked',
          record: { kind: 'counter-question', id: added.id },
          summary: `Asked the kitchen about ${product.name} (${product.id}) for a customer avoiding ${body.avoid.join(', ')}.`,
          after: view(added),
        },
        t,
      );
      await this.channel.publish({ type: 'question-asked', question: added.id, product: added.productCode }, t, site.id);
      return added;
    });
    return view(row);
  }

  /** Newest first; `open` keeps only the questions not answered yet. */
  async list(open: boolean): Promise<CounterQuestionView[]> {
    const site = await this.kitchen.current();
    return (await this.repo.list(site.id, open)).map(view);
  }

  /** Records the kitchen's answer (once: an answered question keeps its answer) and tells every open counter. */
  async answer(id: string, body: CounterAnswerRequest, user: AuthUser): Promise<CounterQuestionView> {
    const site = await this.kitchen.current();
    const number = /^[1-9]\d{0,9}$/.test(id) ? Number(id) : NaN;
    if (!Number.isSafeInteger(number) || number > 2_147_483_647) throw new AppError('not-found', `There is no question '${id}'.`);
    const row = await this.tx.run(async (t) => {
      const question = await this.repo.lock(site.id, number, t);
      if (!question) throw new AppError('not-found', `There is no question ${number}.`);
      if (question.answer) {
        const message = `This question was answered already, by ${question.answer.by} at ${question.answer.at.toISOString()}.`;
        throw new AppError('conflict', message, [{ path: 'answer', message }]);
      }
      const answered = await this.repo.answer(number, { text: body.answer, by: user.id, byName: user.name }, t);
      await this.audit.record(
        {
          action: 'counter.question-answered',
          record: { kind: 'counter-question', id: number },
          summary: `Answered the question ${number} about ${answered.productName}.`,
          before: view(question),
          after: view(answered),
        },
        t,
      );
      await this.channel.publish({ type: 'question-answered', question: answered.id, product: answered.productCode }, t, site.id);
      return answered;
    });
    return view(row);
  }
}

function view(r: CounterQuestionRow): CounterQuestionView {
  return {
    id: r.id,
    product: r.productCode,
    productName: r.productName,
    avoid: r.avoid,
    note: r.note,
    askedBy: r.askedByName,
    askedAt: r.askedAt.toISOString(),
    answer: r.answer ? { text: r.answer.text, by: r.answer.by, at: r.answer.at.toISOString() } : null,
  };
}
