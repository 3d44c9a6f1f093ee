import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { ApprovalsService } from '../approvals/approvals.service';
import { BooksService } from '../books/books.service';
import { isDemoKitchen, type AppConfig } from '../config/config';
import { KitchenRolesRepository } from '../kitchen/kitchen-roles.repository';
import { KitchenService } from '../kitchen/kitchen.service';
import { LabelSettingsRepository } from '../labels/label-settings.repository';
import { hashPassword } from '../users/password';
import { UsersRepository } from '../users/users.repository';
import demoBook from './seeders/demo-book.json';
import { DEMO_LABEL_SETTINGS } from './seeders/demo-labels';
import { DEMO_PASSWORD, DEMO_SITE_ADDRESS, DEMO_USERS } from './seeders/demo-users';

/**
 * Seeds the demo kitchen into an empty database only, and only in demo mode (its accounts share
 * a published password); running it again changes nothing.
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

  async seedDemo(): Promise<'seeded' | 'kept'> {
    if ((await this.users.count()) > 0 || (await this.kitchen.find())) {
      this.logger.log('The database already holds a kitchen: seed skipped.');
      return 'kept';
    }
    const demo = isDemoKitchen(this.config);
    if (!demo) {
      this.logger.warn('Not the demo kitchen (DEMO_KITCHEN=false, or HOST beyond loopback): no demo data or accounts seeded.');
      return 'kept';
    }
    const hash = await hashPassword(DEMO_PASSWORD);
    await this.books.importBook(demoBook, { authorId: null, note: 'Demo kitchen', address: DEMO_SITE_ADDRESS });
    await this.labelSettings.save((await this.kitchen.current()).id, DEMO_LABEL_SETTINGS);
    const created = [];
    const kitchens = await this.kitchen.all();
    for (const u of DEMO_USERS) {
      const user = await this.users.create({ ...u, passwordHash: hash, demoPassword: true });
      for (const k of kitchens) await this.kitchenRoles.set(user.id, k.id, u.role);
      created.push(user);
    }
    // The demo starts approved: its manager approves every product's declaration as seeded.
    const manager = created.find((u) => u.role === 'manager')!;
    await this.approvals.approveAll({ id: manager.id, name: manager.name, role: manager.role }, 'Demo kitchen as seeded');
    this.logger.log(
      `Seeded the demo kitchen: ${demoBook.ingredients.length} ingredients, ${demoBook.recipes.length} recipes, ${DEMO_USERS.length} users.`,
    );
    return 'seeded';
  }
}
