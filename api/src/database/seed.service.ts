import { Injectable, Logger } from '@nestjs/common';
import { BooksService } from '../books/books.service';
import { KitchenService } from '../kitchen/kitchen.service';
import { hashPassword } from '../users/password';
import { UsersRepository } from '../users/users.repository';
import demoBook from './seeders/demo-book.json';
import { DEMO_PASSWORD, DEMO_SITE_ADDRESS, DEMO_USERS } from './seeders/demo-users';

/** Seeds the demo kitchen into an empty database only; running it again changes nothing. */
@Injectable()
export class SeedService {
  private readonly logger = new Logger('Seed');

  constructor(
    private readonly users: UsersRepository,
    private readonly books: BooksService,
    private readonly kitchen: KitchenService,
  ) {}

  async seedDemo(): Promise<'seeded' | 'kept'> {
    if ((await this.users.count()) > 0 || (await this.kitchen.find())) {
      this.logger.log('The database already holds a kitchen: seed skipped.');
      return 'kept';
    }
    const hash = await hashPassword(DEMO_PASSWORD);
    await this.books.importBook(demoBook, { authorId: null, note: 'Demo kitchen', address: DEMO_SITE_ADDRESS });
    for (const u of DEMO_USERS) await this.users.create({ ...u, passwordHash: hash });
    this.logger.log(
      `Seeded the demo kitchen: ${demoBook.ingredients.length} ingredients, ${demoBook.recipes.length} recipes, ${DEMO_USERS.length} users.`,
    );
    return 'seeded';
  }
}
