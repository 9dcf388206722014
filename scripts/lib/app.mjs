import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { ROOT } from './paths.mjs';
import { FatalError } from './log.mjs';
import { run } from './run.mjs';

/** Builds shared (emitted JS for Node), the server and the PWA. */
export async function buildAll({ web = true } = {}) {
  await run('npm', ['run', '--silent', 'build', '-w', 'shared'], { cwd: ROOT, label: 'build of shared' });
  await run('npm', ['run', '--silent', 'build', '-w', 'server'], { cwd: ROOT, label: 'build of server' });
  if (web) await run('npm', ['run', '--silent', 'build', '-w', 'mobile-web'], { cwd: ROOT, label: 'build of mobile-web' });
}

/** Applies migrations and, unless `migrateOnly`, seeds the demo scenario. */
export function migrateAndSeed(env, { migrateOnly = false } = {}) {
  const args = [join(ROOT, 'server/dist/seed/seed-cli.js')];
  if (migrateOnly) args.push('--migrate-only');
  return run('node', args, { cwd: ROOT, env, label: migrateOnly ? 'database migration' : 'migration and demo seeding' });
}

/** Starts `node server/dist/main.js` and resolves once /api/health answers ok. */
export async function startServer(env, { timeoutMs = 30_000, stdio = 'inherit' } = {}) {
  const child = spawn('node', [join(ROOT, 'server/dist/main.js')], { cwd: ROOT, env, stdio });
  let exited = null;
  child.on('exit', (code, signal) => (exited = { code, signal }));
  const url = `http://${env.HOST ?? '127.0.0.1'}:${env.PORT}/api/health`;
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (exited) throw new FatalError(`the server exited during start (${exited.signal ?? `exit ${exited.code}`})`);
    try {
      const res = await fetch(url);
      if (res.ok) return child;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  child.kill('SIGTERM');
  throw new Error(`the server did not answer ${url} within ${timeoutMs / 1000} s`);
}

export function stopChild(child, timeoutMs = 5_000) {
  if (!child || child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutMs);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill('SIGTERM');
  });
}
