#!/usr/bin/env node
// `npm run bench:<name>`: builds what the benchmark needs and runs it. Each benchmark prints its
// figures and the ratio to a baseline measured in the same run. Speed is never asserted in tests.
import { ensureDependencies } from './lib/deps.mjs';
import { handleFatal } from './lib/log.mjs';
import { ROOT } from './lib/paths.mjs';
import { run } from './lib/run.mjs';

const BENCHES = {
  // Pure physics: build shared, then run the plain-Node benchmark against shared/dist.
  physics: async () => {
    await run('npm', ['run', '--silent', 'build', '-w', 'shared'], { cwd: ROOT, label: 'build of shared' });
    await run('node', ['shared/bench/physics.bench.mjs'], { cwd: ROOT, label: 'physics benchmark' });
  },
  // The API under load: tests/bench/api.bench.mjs sets up its own database and server.
  api: async () => {
    await run('node', ['tests/bench/api.bench.mjs'], { cwd: ROOT, label: 'API benchmark' });
  },
  // First load in Lighthouse: tests/bench/lighthouse.bench.mjs sets up its own database and server.
  lighthouse: async () => {
    await run('node', ['tests/bench/lighthouse.bench.mjs'], { cwd: ROOT, label: 'Lighthouse benchmark' });
  },
  // Sync push and pull: tests/bench/sync.bench.mjs sets up its own database and server.
  sync: async () => {
    await run('node', ['tests/bench/sync.bench.mjs'], { cwd: ROOT, label: 'sync benchmark' });
  },
  // Report e-mail and PDF: builds shared and the server, then renders and sends to an SMTP fake.
  mail: async () => {
    await run('npm', ['run', '--silent', 'build', '-w', 'shared'], { cwd: ROOT, label: 'build of shared' });
    await run('npm', ['run', '--silent', 'build', '-w', 'server'], { cwd: ROOT, label: 'build of server' });
    await run('node', ['tests/bench/mail.bench.mjs'], { cwd: ROOT, label: 'mail benchmark' });
  },
};

const name = process.argv[2];
const bench = BENCHES[name];
if (!bench) {
  console.error(`usage: node scripts/bench.mjs <${Object.keys(BENCHES).join('|')}>`);
  process.exit(2);
}
await ensureDependencies(ROOT);
await bench().catch(handleFatal);
