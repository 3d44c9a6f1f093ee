// The development inbox: maildev (a devDependency) on loopback, so that the mail npm start,
// npm run dev and npm test send stays on this machine and can be read in a browser. It relays
// nothing (no --outgoing-* or --auto-relay option is ever given). Node built-ins only.
import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { freePort, isPortFree } from './mariadb.mjs';
import { ROOT, startChild, waitForHttp } from './workspace.mjs';

const BIN = join(ROOT, 'node_modules', 'maildev', 'dist', 'bin', 'maildev.js');

/**
 * @typedef {{ smtpPort: number; webPort: number; url: string; env: Record<string, string>; stop(): Promise<void> }} DevInbox
 */

/**
 * Starts maildev on 127.0.0.1 and waits until it answers. Its ports are MAILDEV_SMTP_PORT and
 * MAILDEV_WEB_PORT when set, free ones otherwise; mails are kept in `dir` when one is given.
 * `env` holds the API's SMTP settings that point at it.
 * @param {{ dir?: string; from?: string }} [opts]
 * @returns {Promise<DevInbox>}
 */
export async function startDevInbox(opts = {}) {
  if (!existsSync(BIN)) throw new Error(`The development inbox (maildev) is not installed at ${BIN}: run npm ci.`);
  const smtpPort = await chosenPort('MAILDEV_SMTP_PORT');
  const webPort = await chosenPort('MAILDEV_WEB_PORT');
  const args = [BIN, '--smtp', String(smtpPort), '--web', String(webPort), '--ip', '127.0.0.1', '--web-ip', '127.0.0.1'];
  if (opts.dir) {
    mkdirSync(opts.dir, { recursive: true });
    args.push('--mail-directory', opts.dir);
  }
  const child = startChild('node', args, {}, { stdio: ['ignore', 'ignore', 'inherit'] });
  const url = `http://127.0.0.1:${webPort}`;
  try {
    await waitForHttp(`${url}/api/healthz`, 30_000, child);
  } catch (err) {
    if (child.exitCode === null) child.kill('SIGTERM');
    throw err;
  }
  return {
    smtpPort,
    webPort,
    url,
    env: {
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtpPort),
      SMTP_SECURE: 'false',
      SMTP_USER: '',
      SMTP_PASSWORD: '',
      MAIL_FROM: opts.from ?? 'crumbproof@localhost.localdomain',
    },
    stop: () =>
      new Promise((resolve) => {
        if (child.exitCode !== null) return resolve();
        const timer = setTimeout(() => (child.kill('SIGKILL'), resolve()), 5000);
        child.once('exit', () => (clearTimeout(timer), resolve()));
        child.kill('SIGTERM');
      }),
  };
}

/**
 * @param {string} name
 * @returns {Promise<number>}
 */
async function chosenPort(name) {
  const given = process.env[name];
  if (!given) return freePort();
  const port = Number(given);
  if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error(`${name} must be a port number; it is ${given}.`);
  if (!(await isPortFree(port)))
    throw new Error(`Port ${port} (${name}) is in use. Stop what uses it, or leave ${name} unset for a free one.`);
  return port;
}
