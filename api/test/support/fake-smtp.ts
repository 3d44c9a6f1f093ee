import type { AddressInfo } from 'node:net';
import { simpleParser, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/**
 * A mail server in the test's own process on 127.0.0.1 (smtp-server), keeping every mail it is
 * sent, parsed by mailparser, so the API's mail goes nowhere off the machine and a test reads
 * what was sent. `down()` stops listening (the API's attempts fail to connect) and `up()` listens
 * on the same port again; `refuse` answers every mail with a temporary failure (451).
 */
export interface FakeSmtp {
  port: number;
  mails: ParsedMail[];
  /** Resolves with the first mail (from now on or already kept) that `match` accepts. */
  waitFor(match: (mail: ParsedMail) => boolean, timeoutMs?: number): Promise<ParsedMail>;
  refuse: boolean;
  down(): Promise<void>;
  up(): Promise<void>;
  close(): Promise<void>;
}

export async function startFakeSmtp(): Promise<FakeSmtp> {
  const mails: ParsedMail[] = [];
  const waiting: { match: (m: ParsedMail) => boolean; resolve: (m: ParsedMail) => void }[] = [];
  const state = { refuse: false };
  const make = () =>
    new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, _session, callback) {
        if (state.refuse) {
          stream.resume();
          stream.on('end', () => callback(Object.assign(new Error('Mailbox busy, try later'), { responseCode: 451 })));
          return;
        }
        simpleParser(stream)
          .then((mail) => {
            mails.push(mail);
            for (const w of waiting.filter((x) => x.match(mail))) {
              waiting.splice(waiting.indexOf(w), 1);
              w.resolve(mail);
            }
            callback();
          })
          .catch((err: Error) => callback(err));
      },
    });
  let server = make();
  const listen = (port: number) =>
    new Promise<number>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve((server.server.address() as AddressInfo).port));
    });
  const port = await listen(0);
  let listening = true;
  const stop = () =>
    new Promise<void>((resolve) => {
      if (!listening) return resolve();
      listening = false;
      server.close(() => resolve());
    });
  return {
    port,
    mails,
    get refuse() {
      return state.refuse;
    },
    set refuse(v: boolean) {
      state.refuse = v;
    },
    waitFor(match, timeoutMs = 10_000) {
      const found = mails.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const entry = { match, resolve: (m: ParsedMail) => (clearTimeout(timer), resolve(m)) };
        const timer = setTimeout(() => {
          waiting.splice(waiting.indexOf(entry), 1);
          reject(new Error(`No matching mail within ${timeoutMs} ms; ${mails.length} kept.`));
        }, timeoutMs);
        waiting.push(entry);
      });
    },
    down: stop,
    async up() {
      if (listening) return;
      server = make();
      await listen(port);
      listening = true;
    },
    close: stop,
  };
}
