// Skips a workspace's build when nothing it is built from changed: its sources, configs, the
// lock file and (for server and mobile-web) shared's own inputs. The hash of those inputs is kept
// beside the output (dist/.plummet-build-hash). Built-ins only.
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { ROOT } from './paths.mjs';

/** What each workspace's build reads, relative to the workspace, and the workspaces it builds on. */
export const WORKSPACES = {
  shared: { inputs: ['src', 'package.json', 'tsconfig.json', 'tsconfig.build.json'], dependsOn: [] },
  server: { inputs: ['src', 'package.json', 'tsconfig.json', 'tsconfig.build.json'], dependsOn: ['shared'] },
  'mobile-web': {
    inputs: ['src', 'public', 'scripts', 'index.html', 'package.json', 'tsconfig.json', 'vite.config.ts'],
    dependsOn: ['shared'],
  },
};
const ROOT_INPUTS = ['package-lock.json', 'tsconfig.base.json'];
const STAMP = join('dist', '.plummet-build-hash');

function listFiles(path) {
  if (!existsSync(path)) return [];
  if (!statSync(path).isDirectory()) return [path];
  return readdirSync(path, { withFileTypes: true })
    .filter((entry) => entry.name !== 'node_modules' && entry.name !== 'dist')
    .flatMap((entry) => listFiles(join(path, entry.name)));
}

function hashFiles(hash, files) {
  for (const file of files.sort()) {
    hash.update(relative(ROOT, file)).update('\0').update(readFileSync(file)).update('\0');
  }
}

/** One hash over everything the workspace's build reads, including what it depends on. */
export function inputHash(workspace) {
  const hash = createHash('sha256');
  const seen = new Set();
  const add = (name) => {
    if (seen.has(name)) return;
    seen.add(name);
    WORKSPACES[name].dependsOn.forEach(add);
    hashFiles(hash, WORKSPACES[name].inputs.flatMap((input) => listFiles(join(ROOT, name, input))));
  };
  add(workspace);
  hashFiles(hash, ROOT_INPUTS.map((file) => join(ROOT, file)).filter(existsSync));
  return hash.digest('hex');
}

export function builtHash(workspace) {
  const stamp = join(ROOT, workspace, STAMP);
  return existsSync(stamp) ? readFileSync(stamp, 'utf8').trim() : null;
}

export function isUpToDate(workspace, hash = inputHash(workspace)) {
  return builtHash(workspace) === hash;
}

export function recordBuild(workspace, hash) {
  writeFileSync(join(ROOT, workspace, STAMP), `${hash}\n`);
}
