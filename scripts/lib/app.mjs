import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { ROOT } from './paths.mjs';
import { inputHash, isUpToDate, recordBuild } from './build-cache.mjs';
import { FatalError, say } from './log.mjs';
import { run } from './run.mjs';

/** Builds shared (emitted JS for Node), the server and the PWA, and records what each was built from. */
export async function buildAll({ web = true } = {}) {
  for (const workspace of ['shared', 'server', ...(web ? ['mobile-web'] : [])]) await buildWorkspace(workspace);
}

async function buildWorkspace(workspace) {
  const hash = inputHash(workspace);
  await run('npm', ['run', '--silent', 'build', '-w', workspace], { cwd: ROOT, label: `build of ${workspace}` });
  recordBuild(workspace, hash);
}

/**
 * Like buildAll, but builds only the workspaces whose inputs changed since their last build
 * (a change in shared rebuilds all three). Returns the names of the workspaces it built.
 */
export async function buildChanged({ web = true } = {}) {
  const built = [];
  for (const workspace of ['shared', 'server', ...(web ? ['mobile-web'] : [])]) {
    if (isUpToDate(workspace)) continue;
    say(`building ${workspace}…`);
    await buildWorkspace(workspace);
    built.push(workspace);
  }
  return built;
}

/** Applies migrations and, unless `migrateOnly`, seeds the demo scenario. */
export function migrateAndSeed(env, { migrateOnly = false } = {}) {
  const args = [join(ROOT, 'server/dist/seed/seed-cli.js')];
  if (migrateOnly) args.push('--migrate-only');
  return run('node', args, { cwd: ROOT, env, label: migrateOnly ? 'database migration' : 'migration and demo seeding' });
}

/**
 * Starts `node server/dist/main.js` and resolves once /api/health answers ok. `onSpawn` receives
 * the child at once, so a caller stopped while waiting (Ctrl-C during start) can still stop it.
 */
export async function startServer(env, { timeoutMs = 30_000, stdio = 'inherit', onSpawn } = {}) {
  const child = spawn('node', [join(ROOT, 'server/dist/main.js')], { cwd: ROOT, env, stdio });
  onSpawn?.(child);
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
    await new Promise((r) => setTimeout(r, 50));
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
