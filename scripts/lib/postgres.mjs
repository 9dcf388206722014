import { chmodSync, existsSync, mkdirSync, readdirSync } from 'node:fs';
import { createConnection } from 'node:net';
import { join } from 'node:path';
import { aptInstall, isRoot, runQuiet } from './run.mjs';
import { fail, say } from './log.mjs';

/** Finds Debian's PostgreSQL server binaries, installing the `postgresql` package when missing. */
export async function ensurePostgresBinaries() {
  const find = () => {
    const base = '/usr/lib/postgresql';
    if (!existsSync(base)) return null;
    const versions = readdirSync(base)
      .filter((v) => existsSync(join(base, v, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    return versions.length ? join(base, versions[0], 'bin') : null;
  };
  let bin = find();
  if (!bin) {
    say('PostgreSQL server not found; installing Debian package postgresql…');
    await aptInstall(['postgresql'], 'PostgreSQL is needed');
    bin = find();
    if (!bin) fail('the postgresql package installed no server binaries under /usr/lib/postgresql.');
  }
  return bin;
}

/** PostgreSQL refuses to run as root: run its tools as the `postgres` user then. */
function asPgUser(bin, tool, args) {
  const exe = join(bin, tool);
  return isRoot() ? ['runuser', ['-u', 'postgres', '--', exe, ...args]] : [exe, args];
}

export function portInUse(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const socket = createConnection({ port, host });
    socket.once('connect', () => { socket.destroy(); resolve(true); });
    socket.once('error', () => resolve(false));
  });
}

/**
 * A PostgreSQL cluster in a folder of ours, listening on 127.0.0.1:port only, socket in the folder.
 * Trust authentication is acceptable because it only listens on loopback for development and tests.
 */
export class LocalPostgres {
  /** `durable: false` trades crash safety for speed: only for throwaway test clusters. */
  constructor({ bin, dir, port, user = 'plummet', durable = true }) {
    Object.assign(this, { bin, dir, port, user, durable });
    this.started = false;
  }

  /** URLs of the cluster's owner (the superuser that runs migrations and seeds). */
  get url() {
    return (db) => `postgres://${this.user}@127.0.0.1:${this.port}/${db}`;
  }

  /** URL of another role of the cluster (e.g. the application role). */
  urlAs(user, password, db) {
    const auth = password ? `${encodeURIComponent(user)}:${encodeURIComponent(password)}` : encodeURIComponent(user);
    return `postgres://${auth}@127.0.0.1:${this.port}/${db}`;
  }

  /**
   * The server's own role: may sign in, owns nothing, cannot bypass row-level security. Created
   * once per cluster; the migrations grant it its rights in each database.
   */
  ensureApplicationRole(name, password) {
    if (!/^[a-z_][a-z0-9_]*$/.test(name)) fail(`PG_APP_USER must be a plain lower-case role name, not ${JSON.stringify(name)}`);
    if (name === this.user) fail(`PG_APP_USER must differ from the owner role ${this.user}`);
    const passwordSql = password ? ` PASSWORD '${password.replaceAll("'", "''")}'` : '';
    const exists = this.psql(`SELECT 1 FROM pg_roles WHERE rolname = '${name}'`) === '1';
    this.psql(`${exists ? 'ALTER' : 'CREATE'} ROLE "${name}" LOGIN NOSUPERUSER NOBYPASSRLS NOCREATEDB NOCREATEROLE${passwordSql}`);
  }

  async init() {
    if (existsSync(join(this.dir, 'PG_VERSION'))) return false;
    mkdirSync(this.dir, { recursive: true });
    if (isRoot() && !runQuiet('runuser', ['-u', 'postgres', '--', 'test', '-x', this.dir]).ok) {
      fail(`the postgres user cannot reach ${this.dir} (a parent folder is private); clone the repository elsewhere or set PLUMMET_DATA_DIR.`);
    }
    if (isRoot()) {
      runQuiet('chown', ['-R', 'postgres:postgres', this.dir]);
      chmodSync(this.dir, 0o700);
    }
    const [cmd, args] = asPgUser(this.bin, 'initdb', ['-D', this.dir, '-U', this.user, '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
    const r = runQuiet(cmd, args);
    if (!r.ok) fail(`initdb failed in ${this.dir}: ${(r.stderr || r.stdout).trim().split('\n').pop()}`);
    return true;
  }

  async start() {
    if (await portInUse(this.port)) fail(`port ${this.port} on 127.0.0.1 is already in use; set PG_PORT to another port.`);
    let opts = `-c listen_addresses=127.0.0.1 -p ${this.port} -k ${this.dir} -c max_connections=300`;
    if (!this.durable) opts += ' -c fsync=off -c synchronous_commit=off -c full_page_writes=off';
    const [cmd, args] = asPgUser(this.bin, 'pg_ctl', ['-D', this.dir, '-l', join(this.dir, 'server.log'), '-o', opts, '-w', '-t', '30', 'start']);
    const r = runQuiet(cmd, args);
    if (!r.ok) fail(`PostgreSQL did not start (see ${join(this.dir, 'server.log')}): ${(r.stderr || r.stdout).trim().split('\n').pop()}`);
    this.started = true;
  }

  stop() {
    if (!this.started) return;
    const [cmd, args] = asPgUser(this.bin, 'pg_ctl', ['-D', this.dir, '-m', 'fast', '-w', 'stop']);
    runQuiet(cmd, args);
    this.started = false;
  }

  psql(sql, db = 'postgres') {
    const r = runQuiet(join(this.bin, 'psql'), ['-h', '127.0.0.1', '-p', String(this.port), '-U', this.user, '-d', db, '-v', 'ON_ERROR_STOP=1', '-Atc', sql]);
    if (!r.ok) throw new Error(`psql: ${r.stderr.trim()}`);
    return r.stdout.trim();
  }

  async ensureDatabase(name) {
    const exists = this.psql(`SELECT 1 FROM pg_database WHERE datname = '${name}'`);
    if (exists !== '1') this.psql(`CREATE DATABASE "${name}"`);
  }
}
