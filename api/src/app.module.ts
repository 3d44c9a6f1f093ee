import { Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD, DiscoveryModule } from '@nestjs/core';
import { AuthModule } from './auth/auth.module';
import { ApiExceptionFilter } from './common/exception.filter';
import { RolesGuard, SessionGuard } from './common/auth.guard';
import { AppConfigModule } from './config/config.module';
import { DatabaseModule } from './database/database.module';
import { HealthController } from './health.controller';
import { KitchenModule } from './kitchen/kitchen.module';
import { UsersModule } from './users/users.module';
import { BooksModule } from './books/books.module';
import { SeedModule } from './database/seed.module';
import { SwapsModule } from './swaps/swaps.module';
import { ReferenceModule } from './reference/reference.module';
import { SpecificationsModule } from './specifications/specifications.module';
import { IngredientImportModule } from './ingredient-import/ingredient-import.module';

@Module({
  imports: [
    DiscoveryModule,
    AppConfigModule,
    DatabaseModule,
    AuthModule,
    UsersModule,
    KitchenModule,
    BooksModule,
    SeedModule,
    SwapsModule,
    SpecificationsModule,
    IngredientImportModule,
    ReferenceModule,
  ],
  controllers: [HealthController],
  providers: [
    { provide: APP_GUARD, useClass: SessionGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
    { provide: APP_FILTER, useClass: ApiExceptionFilter },
  ],
})
export class AppModule {}
