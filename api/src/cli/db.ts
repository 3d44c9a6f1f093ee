/**
 * Database set-up from the command line: `node api/dist/cli/db.js migrate|seed|setup`.
 * setup = migrate, then seed the demo kitchen into an empty database.
 */
import 'reflect-metadata';
import { Module } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { Sequelize } from 'sequelize-typescript';
import { AppConfigModule } from '../config/config.module';
import { DatabaseModule } from '../database/database.module';
import { migrateUp } from '../database/migrator';
import { SeedModule } from '../database/seed.module';
import { SeedService } from '../database/seed.service';

@Module({ imports: [AppConfigModule, DatabaseModule, SeedModule] })
class DbCliModule {}

async function main(command: string) {
  if (!['migrate', 'seed', 'setup'].includes(command)) {
    console.error('Use: db migrate | db seed | db setup');
    process.exit(2);
  }
  const ctx = await NestFactory.createApplicationContext(DbCliModule, { logger: ['error', 'warn'] });
  try {
    if (command !== 'seed') {
      const done = await migrateUp(ctx.get(Sequelize));
      console.log(done.length ? `Applied ${done.length} migration(s): ${done.map((m) => m.name).join(', ')}` : 'The schema is up to date.');
    }
    if (command !== 'migrate') {
      const result = await ctx.get(SeedService).seedDemo();
      console.log(result === 'seeded' ? 'Seeded the demo kitchen.' : 'Kept the existing data.');
    }
  } finally {
    await ctx.close();
  }
}

main(process.argv[2] ?? 'setup').catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
