import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ROLES, addedName, addsAllergen, declaredChangeInWords, declarationInWords } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { BooksService, type KitchenState, type KitchenWritten } from '../books/books.service';
import { currentRequest } from '../common/request-context';
import { appAddress, type AppConfig } from '../config/config';
import type { SiteRow } from '../kitchen/site.repository';
import { MailService } from '../mail/mail.service';
import { renderMail, type RenderedMail } from '../mail/templates/layout';
import { recipesAboveAny } from '../rules/core/book-graph';
import { ApprovalStatus, type ProductStatus } from './approval-status';

/** A product as a mail lists it: its name and its change in sentences. */
interface MailedProduct {
  name: string;
  words: string[];
  addsAllergen: boolean;
}

/**
 * To a kitchen's managers: a write sent products to approval there (one mail per write and
 * kitchen, every product in it). `several`: the installation has several kitchens, so the mail names this one.
 */
export function approvalNeededMail(m: {
  kitchen: string;
  several?: boolean;
  by: string;
  products: MailedProduct[];
  url: string;
}): RenderedMail {
  const one = m.products.length === 1;
  const at = m.several ? ` at ${m.kitchen}` : '';
  return renderMail({
    kitchen: m.kitchen,
    aboutAllergens: true,
    subject: one ? `${m.products[0].name} waits for your approval${at}` : `${m.products.length} products wait for your approval${at}`,
    greeting: 'Hello,',
    paragraphs: [
      `${m.by} saved a change that reaches ${one ? 'this product' : 'these products'}${at}: ${one ? 'its labels print' : 'their labels print'}${m.several ? ' there' : ''} again only once a manager${at} approves ${one ? 'its' : 'each'} declaration as it is now.`,
      ...m.products.map((p) => `${p.name}${p.addsAllergen ? ' (adds an allergen)' : ''}: ${p.words.join(' ')}`),
    ],
    action: { label: 'Open Approvals', url: m.url },
  });
}

/** To everyone active at the kitchen, front of house too: an approved change adds an allergen to products. */
export function allergenApprovedMail(m: {
  kitchen: string;
  by: string;
  products: { name: string; added: string[] }[];
  url: string;
}): RenderedMail {
  const one = m.products.length === 1;
  return renderMail({
    kitchen: m.kitchen,
    aboutAllergens: true,
    subject: one
      ? `${m.products[0].name} now has an allergen it did not have`
      : `${m.products.length} products now have allergens they did not have`,
    greeting: 'Hello,',
    paragraphs: [
      `${m.by} approved a change that adds an allergen. Answer customers from the counter as it shows now, and tell anyone who has asked before.`,
      ...m.products.map((p) => `${p.name}: ${p.added.join(' ')}`),
    ],
    action: { label: 'Open the counter', url: m.url },
  });
}

/**
 * The approvals' mail: "approval needed" to the managers of each kitchen where a write
 * (BooksService's listener) leaves products waiting, and "an approved change adds an allergen" to
 * everyone active at the kitchen of the approval, in its transaction.
 */
@Injectable()
export class ApprovalMails implements OnModuleInit {
  private readonly logger = new Logger(ApprovalMails.name);

  constructor(
    private readonly books: BooksService,
    private readonly status: ApprovalStatus,
    private readonly mail: MailService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  onModuleInit() {
    this.books.onKitchenSaved(async (written) => {
      // Who wrote, from the request the write came with; a write without one (the demo seed) tells no one.
      const by = currentRequest()?.actor?.name;
      if (by) await this.approvalNeeded(written, by);
    });
  }

  /**
   * After a write is saved: the items are shared by every kitchen, so each kitchen where the
   * write leaves products waiting gets one mail, to its own managers, listing them.
   */
  private async approvalNeeded(written: KitchenWritten, by: string): Promise<void> {
    try {
      const kitchens = await this.books.everyKitchen();
      for (const state of kitchens) await this.approvalNeededAt(state, written, by, kitchens.length > 1);
    } catch (e) {
      // The write is saved; the Approvals page lists what waits whatever the mail.
      this.logger.warn(`Could not queue the approval-needed mail: ${String(e)}`);
    }
  }

  private async approvalNeededAt(state: KitchenState, written: KitchenWritten, by: string, several: boolean): Promise<void> {
    // Everything above any written item, in one walk of the book however many were written (an import writes thousands).
    const touched = new Set<string>([...written.recipes, ...recipesAboveAny(state.book, [...written.ingredients, ...written.recipes])]);
    const codes = state.book.recipes.filter((r) => r.sale && touched.has(r.id)).map((r) => r.id);
    if (codes.length === 0) return;
    const waiting = (await this.status.of(state, codes)).filter((s) => s.state !== 'approved');
    if (waiting.length === 0) return;
    const to = await this.mail.addressesOf(['manager'], state.site.id);
    if (to.length === 0) return;
    const body = approvalNeededMail({
      kitchen: state.site.name,
      several,
      by,
      products: waiting.map(mailed),
      url: `${appAddress(this.config)}/approvals`,
    });
    await this.mail.enqueue({ kind: 'approval-needed', kitchenId: state.site.id, to, ...body });
  }

  /**
   * With an approval, in its transaction: everyone active at the kitchen it was given at is told
   * of the products whose approved change adds an allergen.
   */
  async allergenApproved(
    kitchen: Pick<SiteRow, 'id' | 'name'>,
    by: string,
    approved: readonly ProductStatus[],
    t: Transaction,
  ): Promise<void> {
    const adding = approved.filter((s) => s.change && s.change.added.length > 0);
    if (adding.length === 0) return;
    const to = await this.mail.addressesOf(ROLES, kitchen.id, t);
    if (to.length === 0) return;
    const body = allergenApprovedMail({
      kitchen: kitchen.name,
      by,
      products: adding.map((s) => ({
        name: s.product.name,
        added: s.change!.added.map((a) => `${a.how === 'contains' ? 'now contains' : 'now may contain'} ${addedName(a)}.`),
      })),
      url: `${appAddress(this.config)}/counter`,
    });
    await this.mail.enqueue({ kind: 'allergen-approved', kitchenId: kitchen.id, to, ...body }, t);
  }
}

function mailed(s: ProductStatus): MailedProduct {
  return {
    name: s.product.name,
    words: s.change ? declaredChangeInWords(s.change) : ['Never approved.', ...declarationInWords(s.current.served)],
    addsAllergen: s.change ? addsAllergen(s.change) : false,
  };
}
