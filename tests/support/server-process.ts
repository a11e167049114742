// Runs the real server (server/src/index.ts) as a child process on a free port, for tests
// that need more than one process on one database or that kill a process outright.
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));

export interface ServerProcess {
  baseUrl: string;
  child: ChildProcess;
  /** Resolves when the process has ended, with its exit code or the signal that ended it. */
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  /** Everything it wrote, for failure messages. */
  output(): string;
  /** Stops it (SIGTERM, then SIGKILL after 10 s) and waits for the end. */
  stop(): Promise<void>;
}

/** Whether nothing listens on this port of 127.0.0.1 right now. */
function isFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
  });
}

/**
 * A free port for a process started later, taken below Linux's ephemeral range (32768 and
 * up): a port the kernel handed out and took back could be given to any outgoing
 * connection while the process starts, and its listen would then fail.
 */
export async function freePort(): Promise<number> {
  for (;;) {
    const port = 20_000 + Math.floor(Math.random() * 12_000);
    if (await isFree(port)) return port;
  }
}

/** Starts a server process with these environment settings (DATABASE_URL, SMTP_PORT, ...). */
export async function startServerProcess(env: Record<string, string>, port?: number): Promise<ServerProcess> {
  const listenPort = port ?? (await freePort());
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/src/index.ts'], {
    cwd: root,
    env: {
      PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '/tmp', NODE_ENV: 'test', HOST: '127.0.0.1', PORT: String(listenPort),
      LOG_LEVEL: 'warn', SERVE_CLIENT: 'false', WEB_CONCURRENCY: '1', ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server process did not start within 120 s:\n${output}`)), 120_000);
    const onData = () => {
      if (!/Pollenpact is ready/.test(output)) return;
      clearTimeout(timer);
      child.stdout!.off('data', onData);
      resolve();
    };
    child.stdout!.on('data', onData);
    void exited.then(({ code, signal }) => {
      clearTimeout(timer);
      reject(new Error(`server process ended before it was ready (${signal ?? code}):\n${output}`));
    });
  });
  return {
    baseUrl: `http://127.0.0.1:${listenPort}`,
    child,
    exited,
    output: () => output,
    async stop() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
      await exited;
      clearTimeout(timer);
    },
  };
}
