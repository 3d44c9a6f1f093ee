import { Module } from '@nestjs/common';
import { ApprovalsModule } from '../approvals/approvals.module';
import { BooksModule } from '../books/books.module';
import { DeclarationsModule } from '../declarations/declarations.module';
import { KitchenModule } from '../kitchen/kitchen.module';
import { LabelsModule } from '../labels/labels.module';
import { UsersModule } from '../users/users.module';
import { SeedService } from './seed.service';

/** Seeds the demo kitchen; DeclarationsModule keeps each seeded recipe's declaration as it is imported; LabelsModule keeps its label settings; ApprovalsModule approves every demo product as the demo manager. */
@Module({
  imports: [ApprovalsModule, BooksModule, DeclarationsModule, KitchenModule, LabelsModule, UsersModule],
  providers: [SeedService],
  exports: [SeedService],
})
export class SeedModule {}
