import { ConfigService } from '@nestjs/config';
import { createApp } from './app.factory';
import type { AppConfig } from './config/config';

async function main() {
  const app = await createApp();
  app.enableShutdownHooks();
  const config = app.get<ConfigService<AppConfig, true>>(ConfigService);
  const host = config.get('HOST', { infer: true });
  const port = config.get('PORT', { infer: true });
  await app.listen({ host, port });
  console.log(`Crumbproof API listening on http://${host}:${port}`);
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
