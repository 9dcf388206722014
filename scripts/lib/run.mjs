import { spawn, spawnSync } from 'node:child_process';
import { FatalError, fail } from './log.mjs';

/** Runs a command to completion, inheriting stdio; rejects with a one-line message on failure. */
export function run(cmd, args, opts = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...opts });
    child.on('error', (e) => reject(new FatalError(`${cmd} could not start: ${e.message}`)));
    child.on('exit', (code, signal) => {
      if (code === 0) resolve();
      else reject(new FatalError(`${opts.label ?? [cmd, ...args].join(' ')} failed (${signal ?? `exit ${code}`})`));
    });
  });
}

export function runQuiet(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { encoding: 'utf8', ...opts });
  return { ok: r.status === 0, stdout: r.stdout ?? '', stderr: r.stderr ?? '', status: r.status };
}

export function commandExists(cmd) {
  return runQuiet('sh', ['-c', `command -v ${cmd}`]).ok;
}

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** Installs Debian packages with apt-get (as root, or through passwordless sudo). */
export async function aptInstall(packages, why) {
  if (!commandExists('apt-get')) fail(`${why}: apt-get is not available; install ${packages.join(' ')} by hand.`);
  const sudo = isRoot() ? [] : commandExists('sudo') ? ['sudo', '-n'] : null;
  if (!sudo) fail(`${why}: run as root or with sudo to install ${packages.join(' ')}.`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const apt = (args, label) => {
    const argv = [...sudo, 'apt-get', ...args];
    return run(argv[0], argv.slice(1), { env, label });
  };
  const label = `apt-get install ${packages.join(' ')}`;
  try {
    await apt(['install', '-y', '--no-install-recommends', ...packages], label);
  } catch {
    await apt(['update'], 'apt-get update').catch(() => fail('apt-get update failed; check the network or apt sources.'));
    await apt(['install', '-y', '--no-install-recommends', ...packages], label).catch(() => fail(`${label} failed.`));
  }
}
