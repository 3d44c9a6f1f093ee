import { request, type IncomingMessage } from 'node:http';

/** An open events stream: every event as it arrives, with its raw text. */
export interface Stream {
  response: IncomingMessage;
  text: () => string;
  /** The next event of a type that arrives after `since` (an offset in the text), or null after `ms`. */
  next: (type: string, since: number, ms: number) => Promise<{ data: Record<string, unknown>; afterMs: number } | null>;
  close: () => void;
}

export function openStream(port: number, cookie: string, path = '/api/counter/events'): Promise<Stream> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, path, headers: { cookie, accept: 'text/event-stream' } }, (response) => {
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (chunk: string) => (text += chunk));
      resolve({
        response,
        text: () => text,
        next: (type, since, ms) =>
          new Promise((done) => {
            const started = Date.now();
            const look = () => {
              const block = text
                .slice(since)
                .split('\n\n')
                .find((b) => b.startsWith(`event: ${type}\n`));
              if (block)
                done({ data: JSON.parse(/^data: (.*)$/m.exec(block)![1]) as Record<string, unknown>, afterMs: Date.now() - started });
              else if (Date.now() - started > ms) done(null);
              else setTimeout(look, 10);
            };
            look();
          }),
        close: () => req.destroy(),
      });
    });
    req.on('error', reject);
    req.end();
  });
}
