// A TCP proxy a test puts between a server and PostgreSQL (to take the database away) or
// between a browser and our server (to take the signal away): cut() drops every connection
// and refuses new ones for a while, restore() ends that early; cutOn(pattern) cuts the
// moment a client sends a matching statement (e.g. in the middle of a save's transaction,
// or just after its COMMIT reached the database);
// httpRequests() lists the HTTP requests that reached the server through it (what the
// server was asked, whichever page or worker asked it).
import { connect, createServer, type Socket } from 'node:net';

export interface TcpProxy {
  port: number;
  /** Drops every connection and refuses new ones for `ms`. */
  cut(ms: number): void;
  /** Accepts connections again now, however long the cut was meant to last. */
  restore(): void;
  /**
   * Cuts for `ms` as soon as a client sends bytes matching `pattern`; resolves when it did.
   * With `passOn`, those bytes still reach the server and only its answer is lost (the
   * statement runs, e.g. a COMMIT, and the client never hears so). With `afterOnSameConnection`,
   * only a connection that sent bytes matching it earlier counts (one transaction's COMMIT).
   */
  cutOn(pattern: RegExp, ms: number, options?: { passOn?: boolean; afterOnSameConnection?: RegExp }): Promise<void>;
  /** The HTTP requests passed on so far, as `METHOD /path` (query left off), oldest first. */
  httpRequests(): string[];
  /** Whether connections are being refused now. */
  readonly down: boolean;
  close(): Promise<void>;
}

export async function startTcpProxy(target: { host: string; port: number }): Promise<TcpProxy> {
  const open = new Set<Socket>();
  let downUntil = 0;
  let trigger: { pattern: RegExp; ms: number; passOn: boolean; marker?: RegExp; fired: () => void } | null = null;
  /** How long a passed-on statement is given to run before the connections are dropped. */
  const passOnMs = 200;
  const isDown = () => Date.now() < downUntil;
  const requests: string[] = [];
  // An HTTP/1.1 request line at the start of a chunk or after the previous request's end.
  const requestLine = /(?:^|\r\n)(GET|HEAD|POST|PUT|PATCH|DELETE|OPTIONS) (\/[^\s?]*)\S* HTTP\/1\.[01]\r\n/g;

  const cut = (ms: number) => {
    downUntil = Date.now() + ms;
    for (const s of open) s.destroy();
    open.clear();
  };

  const server = createServer((client) => {
    if (isDown()) return void client.destroy();
    const upstream = connect(target.port, target.host);
    open.add(client);
    open.add(upstream);
    const end = () => {
      client.destroy();
      upstream.destroy();
      open.delete(client);
      open.delete(upstream);
    };
    let answerLost = false;
    let sentMarker = false;
    client.on('data', (chunk) => {
      const text = chunk.toString('latin1');
      if (trigger?.marker?.test(text)) sentMarker = true;
      if (trigger && (!trigger.marker || sentMarker) && trigger.pattern.test(text)) {
        const { ms, passOn, fired } = trigger;
        trigger = null;
        if (!passOn) {
          cut(ms);
          fired();
          return;
        }
        answerLost = true;
        upstream.write(chunk);
        setTimeout(() => { cut(ms); fired(); }, passOnMs);
        return;
      }
      for (const [, method, path] of chunk.toString('latin1').matchAll(requestLine)) requests.push(`${method} ${path}`);
      upstream.write(chunk);
    });
    upstream.on('data', (chunk) => { if (!answerLost) client.write(chunk); });
    for (const s of [client, upstream]) {
      s.on('close', end);
      s.on('error', end);
    }
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  return {
    port,
    cut,
    restore: () => { downUntil = 0; },
    cutOn: (pattern, ms, options = {}) => new Promise<void>((fired) => (trigger = { pattern, ms, passOn: options.passOn ?? false, marker: options.afterOnSameConnection, fired })),
    httpRequests: () => [...requests],
    get down() { return isDown(); },
    async close() {
      for (const s of open) s.destroy();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
