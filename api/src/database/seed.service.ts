import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { LabelSettings } from '@crumbproof/shared';
import { ApprovalsService } from '../approvals/approvals.service';
import { BooksService } from '../books/books.service';
import { runInRequest } from '../common/request-context';
import { isDemoKitchen, type AppConfig } from '../config/config';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import { LabelSettingsRepository } from '../labels/label-settings.repository';
import { hashPassword } from '../users/password';
import { UsersRepository } from '../users/users.repository';
import demoBook from './seeders/demo-book.json';
import demoChainBook from './seeders/demo-chain-book.json';
import { DEMO_CHAIN_LABEL_SETTINGS, DEMO_LABEL_SETTINGS } from './seeders/demo-labels';
import { DEMO_CHAIN_USERS, DEMO_PASSWORD, DEMO_SITE_ADDRESS, DEMO_USERS, type DemoPerson } from './seeders/demo-users';

/** A book to seed, with its people and the label settings of each kitchen. */
export interface SeedKitchen {
  /** A recipe book file: one kitchen as site, or several as sites. */
  book: unknown;
  people: readonly DemoPerson[];
  /** Each kitchen's label settings by its id in the book; a book given as site: under 'site'. */
  labels: Record<string, LabelSettings>;
  /** What the book import and the approvals are noted as. */
  note: string;
}

/** The app's demo: the chain of two kitchens over one recipe book (demo-chain-book.json). */
export const DEMO_CHAIN: SeedKitchen = {
  book: demoChainBook,
  people: DEMO_CHAIN_USERS,
  labels: DEMO_CHAIN_LABEL_SETTINGS,
  note: 'Demo kitchens',
};

/** The one-kitchen demo (demo-book.json, Wrenfield Lane Bakehouse alone), which the API's integration tests are written on. */
export const DEMO_ONE_KITCHEN: SeedKitchen = {
  book: demoBook,
  people: DEMO_USERS,
  labels: { site: DEMO_LABEL_SETTINGS },
  note: 'Demo kitchen',
};

/**
 * Seeds the demo into an empty database only, and only in demo mode (its accounts share a
 * published password); running it again, or over a database that holds a kitchen, changes nothing.
 */
@Injectable()
export class SeedService {
  private readonly logger = new Logger('Seed');

  constructor(
    private readonly users: UsersRepository,
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
    private readonly labelSettings: LabelSettingsRepository,
    private readonly approvals: ApprovalsService,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly kitchenRoles: KitchenRolesRepository,
  ) {}

  /** The demo chain: both kitchens, their label settings, the demo people with their role at each, every product approved at each. */
  seedDemo(): Promise<'seeded' | 'kept'> {
    return this.seedKitchen(DEMO_CHAIN);
  }

  /**
   * Seeds a book and its people into an empty database: the book's kitchens, each kitchen's label
   * settings, every person with their role at each of their kitchens, and every product's
   * declaration approved at each kitchen by a manager of that kitchen, as seeded.
   */
  async seedKitchen(seed: SeedKitchen): Promise<'seeded' | 'kept'> {
    if ((await this.users.count()) > 0 || (await this.kitchen.find())) {
      this.logger.log('The database already holds a kitchen: seed skipped.');
      return 'kept';
    }
    if (!isDemoKitchen(this.config)) {
      this.logger.warn('Not the demo kitchen (DEMO_KITCHEN=false, or HOST beyond loopback): no demo data or accounts seeded.');
      return 'kept';
    }
    const hash = await hashPassword(DEMO_PASSWORD);
    const summary = await this.books.importBook(seed.book, { authorId: null, note: seed.note, address: DEMO_SITE_ADDRESS });
    const kitchens = await this.kitchen.all();
    // A kitchen by its id in the book: a book given as site has its one kitchen, without an id, as 'site'.
    const byKey = new Map(kitchens.map((k) => [k.code ?? 'site', k]));
    const unknown = [...Object.keys(seed.labels), ...seed.people.flatMap((p) => Object.keys(p.at ?? {}))].filter((k) => !byKey.has(k));
    if (unknown.length > 0) throw new Error(`The seed names kitchens its book does not have: ${[...new Set(unknown)].join(', ')}.`);
    for (const [key, settings] of Object.entries(seed.labels)) await this.labelSettings.save(byKey.get(key)!.id, settings);
    const managers = new Map<number, { id: number; name: string; role: 'manager' }>();
    for (const person of seed.people) {
      const { at, ...fields } = person;
      const user = await this.users.create({ ...fields, passwordHash: hash, demoPassword: true });
      const roles = at
        ? Object.entries(at).map(([key, role]) => [byKey.get(key)!, role] as const)
        : kitchens.map((k) => [k, person.role] as const);
      for (const [site, role] of roles) {
        await this.kitchenRoles.set(user.id, site.id, role);
        if (role === 'manager' && !managers.has(site.id)) managers.set(site.id, { id: user.id, name: user.name, role });
      }
    }
    // The demo starts approved: at each kitchen, its manager approves every product's declaration there as seeded.
    for (const site of kitchens) {
      const manager = managers.get(site.id);
      if (!manager) throw new Error(`The seed gives ${site.name} no manager to approve its products.`);
      await runInRequest({ actor: manager, address: null, kitchenId: site.id }, () =>
        this.approvals.approveAll(manager, `${site.name} as seeded`),
      );
    }
    this.logger.log(
      `Seeded the demo: ${kitchens.map((k) => k.name).join(' and ')}; ${summary.ingredients.created.length} ingredients, ` +
        `${summary.recipes.created.length} recipes, ${seed.people.length} people.`,
    );
    return 'seeded';
  }
}
