import { Injectable } from '@nestjs/common';
import {
  itemIdSchema,
  publicPageUrl,
  readAloud,
  type BookRecipe,
  type PublicPageSettings,
  type PublicPageSettingsView,
} from '@crumbproof/shared';
import { AuditService } from '../audit/audit.service';
import { BooksService } from '../books/books.service';
import { TransactionRunner } from '../common/transaction';
import { DeclarationsService } from '../declarations/declarations.service';
import { KitchenService } from '../kitchen/kitchen.service';
import type { SiteRow } from '../kitchen/site.repository';
import { RulesService } from '../rules/rules.service';
import { notFoundPage, productPage, whichKitchenPage, type PublicPage } from './public-page-html';
import { PublicPageSettingsRepository } from './public-page-settings.repository';

/** The public page is off until the manager turns it on. */
const OFF: PublicPageSettings = { enabled: false, baseUrl: null };

/** A kitchen's part of its pages' addresses: its id in the book (its number when it has none). */
const segmentOf = (site: SiteRow) => site.code ?? String(site.id);

/** A product shows on the public page only when it is for sale and marked published. */
export const isPublished = (recipe: Pick<BookRecipe, 'sale'> | undefined): boolean => recipe?.sale?.published === true;

/**
 * The kitchen's public product page: its settings (manager), the page of each published product
 * (anyone, no sign-in) and the address a counter ticket's QR code carries.
 */
@Injectable()
export class PublicPageService {
  constructor(
    private readonly settingsRepo: PublicPageSettingsRepository,
    private readonly kitchen: KitchenService,
    private readonly books: BooksService,
    private readonly declarations: DeclarationsService,
    private readonly rules: RulesService,
    private readonly tx: TransactionRunner,
    private readonly audit: AuditService,
  ) {}

  async settings(): Promise<PublicPageSettingsView> {
    const site = await this.kitchen.current();
    const row = await this.settingsRepo.find(site.id);
    const kitchen = await this.segment(site);
    return row
      ? { enabled: row.enabled, baseUrl: row.baseUrl, updatedAt: row.updatedAt.toISOString(), kitchen }
      : { ...OFF, updatedAt: null, kitchen };
  }

  /** The kitchen's part of its pages' addresses, where the installation has several kitchens; null where it has one. */
  private async segment(site: SiteRow): Promise<string | null> {
    return (await this.kitchen.all()).length > 1 ? segmentOf(site) : null;
  }

  async saveSettings(body: PublicPageSettings): Promise<PublicPageSettingsView> {
    const site = await this.kitchen.current();
    const row = await this.tx.run(async (t) => {
      const before = await this.settingsRepo.find(site.id, t);
      const saved = await this.settingsRepo.save(site.id, body, t);
      const after = { enabled: saved.enabled, baseUrl: saved.baseUrl };
      const summary = `Turned the public product page ${saved.enabled ? `on at ${saved.baseUrl}` : 'off'}.`;
      const record = { kind: 'public-page-settings', id: site.id };
      const was = before ? { enabled: before.enabled, baseUrl: before.baseUrl } : null;
      await this.audit.record({ action: 'public-page.saved', record, summary, before: was, after }, t);
      return saved;
    });
    return { enabled: row.enabled, baseUrl: row.baseUrl, updatedAt: row.updatedAt.toISOString(), kitchen: await this.segment(site) };
  }

  /**
   * The address of a product's public page for its counter ticket's QR code, or null when the
   * kitchen has the page off or the product is not published (the ticket then prints no code).
   */
  async ticketUrls(site: SiteRow, recipes: readonly Pick<BookRecipe, 'id' | 'sale'>[]): Promise<Map<string, string>> {
    const settings = (await this.settingsRepo.find(site.id)) ?? OFF;
    const urls = new Map<string, string>();
    if (!settings.enabled || !settings.baseUrl) return urls;
    const kitchen = await this.segment(site);
    for (const recipe of recipes) if (isPublished(recipe)) urls.set(recipe.id, publicPageUrl(settings.baseUrl, recipe.id, kitchen));
    return urls;
  }

  /**
   * A product's public page: the declaration in plain sentences and the caution, with no ids,
   * revisions, quantities or supplier names. Every address that is not a published product of a
   * kitchen with the page on gets the same page in words, with status 404, so the page tells no
   * one which products exist. The kitchen is the one `kitchen` names (its part of the address,
   * `/p/<kitchen>/<product>`); an address without one is the kitchen's of an installation of one,
   * and, where there are several, a page in words saying the address names no kitchen.
   */
  async page(code: string, kitchen?: string): Promise<PublicPage> {
    if (!itemIdSchema.safeParse(code).success) return notFoundPage();
    const sites = await this.kitchen.all();
    if (kitchen === undefined && sites.length > 1) return whichKitchenPage();
    const site = kitchen === undefined ? sites[0] : sites.find((s) => segmentOf(s) === kitchen);
    if (!site) return notFoundPage();
    const settings = (await this.settingsRepo.find(site.id)) ?? OFF;
    if (!settings.enabled) return notFoundPage();
    const state = await this.books.stateAt(site);
    const recipe = state.book.recipes.find((r) => r.id === code);
    if (!recipe || !isPublished(recipe)) return notFoundPage();
    const [declaration] = await this.declarations.forProducts([recipe.id], undefined, state);
    const said = readAloud(declaration, this.rules.counterRules(declaration.regime));
    return productPage({
      kitchen: state.book.site.name,
      product: recipe.name,
      computedAt: declaration.basis.computedAt,
      incomplete: declaration.errors.length > 0,
      said,
    });
  }
}
