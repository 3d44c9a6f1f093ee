import { ConfigService } from '@nestjs/config';
import { createApp } from './app.factory';
import { FirstManagerService, FIRST_MANAGER_LINK_MINUTES } from './auth/first-manager.service';
import { isDemoKitchen, isLoopback, type AppConfig } from './config/config';

async function main() {
  const app = await createApp();
  app.enableShutdownHooks();
  const config = app.get<ConfigService<AppConfig, true>>(ConfigService);
  const host = config.get('HOST', { infer: true });
  const port = config.get('PORT', { infer: true });
  await app.listen({ host, port });
  console.log(`Crumbproof API listening on http://${host}:${port}`);
  if (isDemoKitchen(config)) {
    console.log('Demo mode: the demo kitchen and its accounts, which share a published password, on this machine only.');
  }
  const link = await app.get(FirstManagerService).issue();
  if (link) {
    const base =
      config.get('PUBLIC_URL', { infer: true })?.replace(/\/+$/, '') ??
      `http://${isLoopback(host) ? host : '<this machine’s address>'}:${port}`;
    console.log(
      [
        '',
        'This kitchen has no manager who can sign in yet. Set the first manager’s password with this one-time link',
        `(it works once, within ${FIRST_MANAGER_LINK_MINUTES} minutes; restart Crumbproof for a new one):`,
        '',
        `  ${base}/first-manager#token=${link.token}`,
        '',
      ].join('\n'),
    );
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
