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
  start(): Promise<void>;
  /** Stops the process and drops its database. */
  dispose(): Promise<void>;
}

/**
 * The built server (`server/dist/main.js`, serving the built PWA) as its own process, on a free
 * port, against a fresh database seeded with the demo scenario.
 */
export async function startBuiltServer(options: { seed?: boolean; env?: Record<string, string> } = {}): Promise<RunningServer> {
  const db = await createTestDatabase();
  const port = await freePort();
  const env = { ...process.env, NODE_ENV: 'test', HOST: '127.0.0.1', PORT: String(port), DATABASE_URL: db.url, ...options.env };
  if (options.seed !== false) await runNode([resolve(ROOT, 'server/dist/seed/seed-cli.js')], env);
  let child: ChildProcess | null = null;
  const url = `http://127.0.0.1:${port}`;

  async function start(): Promise<void> {
    child = spawn('node', [resolve(ROOT, 'server/dist/main.js')], { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
    const deadline = Date.now() + 30_000;
    while (Date.now() < deadline) {
      if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}`);
      try {
        if ((await fetch(`${url}/api/health`)).ok) return;
      } catch {
        /* not yet listening */
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error('server did not become healthy in 30 s');
  }

  async function stop(): Promise<void> {
    const c = child;
    child = null;
    if (!c || c.exitCode !== null) return;
    await new Promise<void>((done) => {
      c.once('exit', () => done());
      c.kill('SIGTERM');
      setTimeout(() => c.kill('SIGKILL'), 5_000).unref();
    });
  }

  await start();
  return {
    url,
    port,
    db,
    stop,
    start,
    async dispose() {
      await stop();
      await db.drop();
    },
  };
}

function runNode(args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((ok, fail) => {
    const c = spawn('node', args, { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
    c.on('exit', (code) => (code === 0 ? ok() : fail(new Error(`${args.join(' ')} exited with ${code}`))));
  });
}
