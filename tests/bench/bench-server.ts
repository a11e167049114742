// The compiled production server run as a child process for a benchmark, on a free
// loopback port, and the browser's way of signing in to it.
import { spawn, type ChildProcess } from 'node:child_process';
import { freePort } from '../support/server-process.js';
// @ts-expect-error plain JavaScript helper shared with npm start
import { ensureServerBuilt, serverEntry } from '../../scripts/lib/server-build.mjs';

export interface BenchServer { baseUrl: string; stop(): Promise<void> }

async function waitForHealth(baseUrl: string, server: ChildProcess) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the server exited with ${server.exitCode}`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return;
    } catch { /* not listening yet */ }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the server did not answer /api/health within 60 s');
}

/** Compiles the server if its sources changed, starts it with `env` and waits for its health route. */
export async function startBenchServer(env: Record<string, string>): Promise<BenchServer> {
  ensureServerBuilt();
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const server = spawn(process.execPath, ['--enable-source-maps', serverEntry], {
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), LOG_LEVEL: 'warn', SERVE_CLIENT: 'false',
      LOGIN_RATE_LIMIT_PER_ACCOUNT: '100000', LOGIN_RATE_LIMIT_PER_ADDRESS: '100000', ...env,
    },
  });
  await waitForHealth(baseUrl, server);
  return {
    baseUrl,
    async stop() {
      if (server.exitCode !== null) return;
      const exited = new Promise((r) => server.once('exit', r));
      server.kill('SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
    },
  };
}

export interface BenchSession { cookie: string; csrfToken: string }

/** Signs in like the browser does: CSRF token first, then the credentials. */
export async function signIn(baseUrl: string, email: string, password = 'pollen-demo-2026'): Promise<BenchSession> {
  const cookies = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair.indexOf('=');
      cookies.set(pair.slice(0, at), pair.slice(at + 1));
    }
  };
  const first = await fetch(`${baseUrl}/api/auth/csrf`);
  keep(first);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const cookie = () => [...cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookie() },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status}`);
  keep(res);
  const body = (await res.json()) as { csrfToken: string };
  return { cookie: cookie(), csrfToken: body.csrfToken };
}
