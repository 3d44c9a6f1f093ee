import { Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD, DiscoveryModule } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { AccountsModule } from './accounts/accounts.module';
import { ApprovalsModule } from './approvals/approvals.module';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { BooksModule } from './books/books.module';
import { ClockModule } from './common/clock';
import { ApiExceptionFilter } from './common/exception.filter';
import { CounterModule } from './counter/counter.module';
import { RolesGuard, SessionGuard } from './auth/auth.guard';
import { AppConfigModule } from './config/config.module';
import { DatabaseModule } from './database/database.module';
import { SeedModule } from './database/seed.module';
import { DeclarationsModule } from './declarations/declarations.module';
import { HealthModule } from './health/health.module';
import { IngredientsModule } from './ingredients/ingredients.module';
import { KitchenModule } from './kitchen/kitchen.module';
import { LabelsModule } from './labels/labels.module';
import { MailModule } from './mail/mail.module';
import { PublicPageModule } from './public-page/public-page.module';
import { RecipesModule } from './recipes/recipes.module';
import { ReferenceModule } from './reference/reference.module';
import { SwapsModule } from './swaps/swaps.module';
import { UsersModule } from './users/users.module';

/** Every folder that owns routes has one module here; a folder's module imports the ones it builds on. */
@Module({
  imports: [
    DiscoveryModule,
    ScheduleModule.forRoot(),
    ClockModule,
    AppConfigModule,
    DatabaseModule,
    HealthModule,
    AuthModule,
    UsersModule,
    AccountsModule,
    MailModule,
    KitchenModule,
    BooksModule,
    IngredientsModule,
    RecipesModule,
    DeclarationsModule,
    SwapsModule,
    ApprovalsModule,
    LabelsModule,
    CounterModule,
    PublicPageModule,
    AuditModule,
    ReferenceModule,
    SeedModule,
  ],
  providers: [
    { provide: APP_GUARD, useClass: SessionGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
