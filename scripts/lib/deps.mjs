import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { run } from './run.mjs';
import { say } from './log.mjs';

/** Runs `npm ci` when node_modules is missing or was installed from another lock. Built-ins only. */
export async function ensureDependencies(root) {
  const lock = join(root, 'package-lock.json');
  const stamp = join(root, 'node_modules', '.plummet-lock-hash');
  const hash = createHash('sha256').update(readFileSync(lock)).digest('hex');
  if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === hash) return false;
  say('installing dependencies (npm ci)…');
  await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, label: 'npm ci' });
  writeFileSync(stamp, hash);
  return true;
}
