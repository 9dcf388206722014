import { type ChildProcess, spawn } from 'node:child_process';
import { createServer } from 'node:net';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createTestDatabase, type TestDatabase } from '../../server/test/test-db.js';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

export function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const srv = createServer();
    srv.once('error', fail);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => ok(port));
    });
  });
}

export interface RunningServer {
  url: string;
  port: number;
  db: TestDatabase;
  /** Stops the process (the database stays, so it can be started again). */
  stop(): Promise<void>;
  /** Starts the process again; `env` replaces variables for this run only (undefined removes one). */
  start(env?: Record<string, string | undefined>): Promise<void>;
  /** Resolves with how the current process ended (exit code or signal), e.g. after an injected fault. */
  exited(): Promise<number | NodeJS.Signals | null>;
  /** Stops the process and drops its database (unless the database was given: its owner drops it). */
  dispose(): Promise<void>;
}

export interface BuiltServerOptions {
  /** Seed the demo scenario (default: true for a new database, false for a given one). */
  seed?: boolean;
  env?: Record<string, string>;
  /** Run against this database instead of a fresh one, so several processes share it. */
  database?: TestDatabase;
}

/**
 * The built server (`server/dist/main.js`, serving the built PWA) as its own process, on a free
 * port, against a fresh database seeded with the demo scenario (or against `options.database`).
 */
export async function startBuiltServer(options: BuiltServerOptions = {}): Promise<RunningServer> {
  const db = options.database ?? (await createTestDatabase());
  const port = await freePort();
  const env = { ...process.env, NODE_ENV: 'test', HOST: '127.0.0.1', PORT: String(port), ...db.serverEnv, ...options.env };
  if (options.seed ?? !options.database) await runNode([resolve(ROOT, 'server/dist/seed/seed-cli.js')], env);
  let child: ChildProcess | null = null;
  let exit: Promise<number | NodeJS.Signals | null> = Promise.resolve(null);
  const url = `http://127.0.0.1:${port}`;
  const ended = (c: ChildProcess) => c.exitCode !== null || c.signalCode !== null;

  async function start(runEnv: Record<string, string | undefined> = {}): Promise<void> {
    const childEnv = Object.fromEntries(Object.entries({ ...env, ...runEnv }).filter(([, value]) => value !== undefined));
    const c = spawn('node', [resolve(ROOT, 'server/dist/main.js')], { cwd: ROOT, env: childEnv, stdio: ['ignore', 'ignore', 'inherit'] });
    child = c;
    exit = new Promise((done) => c.once('exit', (code, signal) => done(signal ?? code)));
    // Generous: under load a start (migrations as the owner, grants, the job queue) can take a while.
    const deadline = Date.now() + 60_000;
    while (Date.now() < deadline) {
      if (ended(c)) throw new Error(`server exited with ${c.signalCode ?? c.exitCode}`);
      try {
        if ((await fetch(`${url}/api/health`)).ok) return;
      } catch {
        /* not yet listening */
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error('server did not become healthy in 60 s');
  }

  async function stop(): Promise<void> {
    const c = child;
    child = null;
    if (!c || ended(c)) return;
    await new Promise<void>((done) => {
      c.once('exit', () => done());
      c.kill('SIGTERM');
      setTimeout(() => c.kill('SIGKILL'), 5_000).unref();
    });
  }

  try {
    await start();
  } catch (error) {
    // A start that fails or times out leaves nothing behind: the process and the fresh database go.
    await stop().catch(() => undefined);
    if (!options.database) await db.drop().catch(() => undefined);
    throw error;
  }
  return {
    url,
    port,
    db,
    stop,
    start,
    exited: () => exit,
    async dispose() {
      await stop();
      if (!options.database) await db.drop();
    },
  };
}

function runNode(args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((ok, fail) => {
    const c = spawn('node', args, { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
    c.on('exit', (code) => (code === 0 ? ok() : fail(new Error(`${args.join(' ')} exited with ${code}`))));
  });
}
