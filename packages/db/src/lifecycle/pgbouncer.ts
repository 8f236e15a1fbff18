// PgBouncer (Debian's `pgbouncer`) in transaction pool mode in front of a PostgreSQL server, as a scaled-out
// deployment would run it: tests start one to prove the API holds up behind it (tests/api/pgbouncer.test.ts).
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { freePort, installDebianPackage, isRoot, prepareDir, processAlive } from './cluster.ts';

const BIN = '/usr/sbin/pgbouncer';
const PREFIX = 'bumperline-pgbouncer-';

/** Installs PgBouncer with apt when missing and we are root; otherwise says which package to install. */
export function ensurePgbouncerInstalled(log: (msg: string) => void = console.log): string {
  if (!existsSync(BIN)) installDebianPackage('pgbouncer', 'PgBouncer', log);
  if (!existsSync(BIN)) throw new Error(`apt-get installed "pgbouncer" but ${BIN} is missing`);
  return BIN;
}

export interface Pooler {
  /** The same database URL (user, password, database) through the pooler. */
  through(url: string): string;
  stop(): Promise<void>;
}

export interface PoolerOptions {
  /** Any URL of the server to pool (only its host and port are used). */
  serverUrl: string;
  /** URLs whose user and password may log in through the pooler (it logs in to the server with them). */
  logins: string[];
  /** Server connections per database and user: fewer than the clients', so clients share them. */
  poolSize: number;
}

/** Stops and removes poolers left by test runs that died (only ours: found by our folder prefix and pid file). */
function removeOrphanedPoolers(): void {
  for (const name of readdirSync(os.tmpdir())) {
    if (!name.startsWith(PREFIX)) continue;
    const ownerPid = Number(name.slice(PREFIX.length).split('-')[0]);
    if (!Number.isInteger(ownerPid) || processAlive(ownerPid)) continue;
    const dir = path.join(os.tmpdir(), name);
    const pidFile = path.join(dir, 'pgbouncer.pid');
    const pid = existsSync(pidFile) ? Number(readFileSync(pidFile, 'utf8').trim()) : NaN;
    if (Number.isInteger(pid) && processAlive(pid) && readFileSync(`/proc/${pid}/comm`, 'utf8').trim() === 'pgbouncer') {
      process.kill(pid, 'SIGTERM');
    }
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Resolves once something accepts connections on the port; rejects if the process exits first or after 15 s. */
async function listening(port: number, child: ChildProcess, logFile: string): Promise<void> {
  const deadline = Date.now() + 15_000;
  for (;;) {
    if (child.exitCode !== null || child.signalCode !== null) break;
    const ok = await new Promise<boolean>((resolve) => {
      const socket = net.connect(port, '127.0.0.1', () => {
        socket.end();
        resolve(true);
      });
      socket.on('error', () => resolve(false));
    });
    if (ok) return;
    if (Date.now() > deadline) break;
    await new Promise((r) => setTimeout(r, 50));
  }
  const logText = existsSync(logFile) ? readFileSync(logFile, 'utf8').slice(-2000) : '';
  throw new Error(`PgBouncer did not start on port ${port}:\n${logText}`);
}

/**
 * Starts PgBouncer on 127.0.0.1 in transaction pool mode, in a throwaway folder. It refuses to run as root,
 * so as root it runs as `postgres`, like the cluster.
 */
export async function startPgbouncer(opts: PoolerOptions): Promise<Pooler> {
  const bin = ensurePgbouncerInstalled();
  removeOrphanedPoolers();
  const dir = path.join(os.tmpdir(), `${PREFIX}${process.pid}-${randomBytes(3).toString('hex')}`);
  prepareDir(dir);
  const server = new URL(opts.serverUrl);
  const port = await freePort();
  const logFile = path.join(dir, 'pgbouncer.log');
  const quoted = (s: string) => `"${s.replace(/"/g, '""')}"`;
  const users = opts.logins.map((login) => {
    const u = new URL(login);
    return `${quoted(decodeURIComponent(u.username))} ${quoted(decodeURIComponent(u.password))}`;
  });
  writeFileSync(path.join(dir, 'userlist.txt'), `${[...new Set(users)].join('\n')}\n`, { mode: 0o600 });
  writeFileSync(
    path.join(dir, 'pgbouncer.ini'),
    [
      '[databases]',
      `* = host=${server.hostname} port=${server.port || 5432}`,
      '[pgbouncer]',
      'listen_addr = 127.0.0.1',
      `listen_port = ${port}`,
      'unix_socket_dir =',
      'auth_type = scram-sha-256',
      `auth_file = ${path.join(dir, 'userlist.txt')}`,
      'pool_mode = transaction',
      `default_pool_size = ${opts.poolSize}`,
      'max_client_conn = 200',
      `logfile = ${logFile}`,
      `pidfile = ${path.join(dir, 'pgbouncer.pid')}`,
      // node-postgres may send these at connect; the pooler need not keep them per server connection.
      'ignore_startup_parameters = extra_float_digits,options',
      '',
    ].join('\n'),
    { mode: 0o600 },
  );
  const ids = isRoot
    ? {
        uid: Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim()),
        gid: Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim()),
      }
    : {};
  if (isRoot) {
    for (const file of ['userlist.txt', 'pgbouncer.ini']) execFileSync('chown', [`${ids.uid}:${ids.gid}`, path.join(dir, file)]);
  }
  const child = spawn(bin, [path.join(dir, 'pgbouncer.ini')], { ...ids, stdio: 'ignore' });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  try {
    await listening(port, child, logFile);
  } catch (err) {
    child.kill('SIGKILL');
    rmSync(dir, { recursive: true, force: true });
    throw err;
  }
  let stopped = false;
  return {
    through(url: string) {
      const u = new URL(url);
      u.hostname = '127.0.0.1';
      u.port = String(port);
      return u.toString();
    },
    async stop() {
      if (stopped) return;
      stopped = true;
      child.kill('SIGTERM');
      await exited;
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
