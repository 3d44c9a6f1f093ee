/**
 * Database set-up from the command line: `node api/dist/cli/db.js migrate|seed|setup`.
 * setup = migrate, then seed the demo (two kitchens over one recipe book) into an empty database.
 */
import 'reflect-metadata';
import { Module } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { ClockModule } from '../common/clock';
import { AppConfigModule } from '../config/config.module';
import { environmentConfig } from '../config/config';
import { DatabaseModule } from '../database/database.module';
import { setUpSchema } from '../database/schema-setup';
import { SeedModule } from '../database/seed.module';
import { SeedService } from '../database/seed.service';

// The seed approves the demo's products, whose module can send mail: its sender needs the clock and
// the scheduler (stopped again when the context closes).
@Module({ imports: [AppConfigModule, ClockModule, ScheduleModule.forRoot(), DatabaseModule, SeedModule] })
class DbCliModule {}

async function main(command: string) {
  if (!['migrate', 'seed', 'setup'].includes(command)) {
    console.error('Use: db migrate | db seed | db setup');
    process.exit(2);
  }
  if (command !== 'seed') {
    // As the owner, before the API's own connection (its runtime user may read no table before the grants).
    const { applied, grants } = await setUpSchema(environmentConfig());
    console.log(applied.length ? `Applied ${applied.length} migration(s): ${applied.join(', ')}` : 'The schema is up to date.');
    if ('skipped' in grants) {
      console.warn(
        'DB_OWNER_USER is not set, so the API runs as the owner of its database: the audit trail is append-only in the API, not in MariaDB.',
      );
    }
  }
  if (command === 'migrate') return;
  const ctx = await NestFactory.createApplicationContext(DbCliModule, { logger: ['error', 'warn'] });
  try {
    const result = await ctx.get(SeedService).seedDemo();
    console.log(result === 'seeded' ? 'Seeded the demo kitchens.' : 'Kept the existing data.');
  } finally {
    await ctx.close();
  }
}

main(process.argv[2] ?? 'setup').catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
