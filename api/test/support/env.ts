// Runs before each test file: every file gets its own database on the test MariaDB, so files
// can run in parallel. npm test provides DB_PORT and the users; the other values have test defaults.
import { randomBytes } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

process.env.DB_HOST ??= '127.0.0.1';
process.env.DB_PORT ??= '3307';
// Two users, as npm start has them: the owner migrates and grants, the app runs as the runtime
// user, who may only read and add audit_events rows (api/src/database/runtime-grants.ts).
process.env.DB_USER ??= 'crumbproof_app';
process.env.DB_PASSWORD ??= 'crumbproof-app-local';
process.env.DB_OWNER_USER ??= 'crumbproof';
process.env.DB_OWNER_PASSWORD ??= 'crumbproof-local';
process.env.DB_NAME = `crumbproof_test_${process.pid}_${randomBytes(3).toString('hex')}`;
process.env.JWT_SECRET = 'a-secret-for-the-api-tests-only-0123456789abcdef';
process.env.LOG_LEVEL = 'silent';
process.env.NODE_ENV = 'test';
// Sign-in counting windows of a day, so a test that signs in many times on a busy machine never
// sees its window roll over halfway.
process.env.SIGN_IN_WINDOW_SECONDS ??= '86400';
delete process.env.WEB_DIST;
// Uploaded files in a folder of this test file's own (removed after it by test/support/after-env.ts),
// never in a bucket set in the shell; a test of object storage sets its own fake server's settings.
process.env.STORAGE = 'local';
process.env.STORAGE_DIR = mkdtempSync(join(tmpdir(), 'crumbproof-test-uploads-'));
for (const name of ['S3_ENDPOINT', 'S3_BUCKET', 'S3_REGION', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY', 'S3_FORCE_PATH_STYLE'])
  delete process.env[name];
// No mail server unless a test starts its own (test/support/fake-smtp.ts): mail stays in the outbox
// and nothing a test queues can leave the machine through a server set in the shell.
for (const name of ['SMTP_HOST', 'SMTP_PORT', 'SMTP_SECURE', 'SMTP_USER', 'SMTP_PASSWORD', 'MAIL_FROM', 'MAIL_POLL_SECONDS'])
  delete process.env[name];
