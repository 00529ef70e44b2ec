import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

/** A PostgreSQL server of its own for one test run: loopback only, in a temporary folder, removed when stopped. */
export interface TestCluster {
  /** Connection URL of the cluster's `postgres` database, as its superuser `postgres` (trust auth, loopback). */
  adminUrl: string;
  dir: string;
  stop(): void;
}

/** Why no cluster can be started on this machine, or null when one can. */
export function clusterUnavailableReason(): string | null {
  if (!findBinary('initdb') || !findBinary('pg_ctl')) {
    return 'the PostgreSQL server programs (initdb, pg_ctl) are not installed: on Debian, apt-get install postgresql';
  }
  if (isRoot() && !postgresUserExists()) {
    return 'running as root and there is no "postgres" user to run the server as (PostgreSQL refuses to run as root)';
  }
  return null;
}

/** initdb's folder of server programs: on PATH, else Debian's /usr/lib/postgresql/<newest>/bin. */
export function findBinary(name: string): string | null {
  for (const dir of (process.env.PATH ?? '').split(path.delimiter)) {
    const candidate = path.join(dir, name);
    if (dir && isExecutable(candidate)) return candidate;
  }
  const root = '/usr/lib/postgresql';
  const versions = fs.existsSync(root)
    ? fs
        .readdirSync(root)
        .filter((v) => /^\d+$/.test(v))
        .sort((a, b) => Number(b) - Number(a))
    : [];
  for (const version of versions) {
    const candidate = path.join(root, version, 'bin', name);
    if (isExecutable(candidate)) return candidate;
  }
  return null;
}

function isExecutable(file: string): boolean {
  try {
    fs.accessSync(file, fs.constants.X_OK);
    return fs.statSync(file).isFile();
  } catch {
    return false;
  }
}

function isRoot(): boolean {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

function postgresUserExists(): boolean {
  return spawnSync('id', ['-u', 'postgres'], { stdio: 'ignore' }).status === 0;
}

/** Runs a server program, as the postgres user when this process is root. */
function runServerProgram(binary: string, args: string[]): void {
  const [command, commandArgs] = isRoot() ? ['runuser', ['-u', 'postgres', '--', binary, ...args]] : [binary, args];
  execFileSync(command, commandArgs, { stdio: ['ignore', 'pipe', 'pipe'] });
}

/** A TCP port on 127.0.0.1 that was free a moment ago. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/**
 * initdb into a fresh temporary folder and start the server on a free loopback port, its socket in that folder.
 * Locale C keeps text ordering byte-wise, as SQLite's default collation.
 */
export async function startCluster(): Promise<TestCluster> {
  const reason = clusterUnavailableReason();
  if (reason) throw new Error(`cannot start a PostgreSQL cluster: ${reason}`);
  const initdb = findBinary('initdb')!;
  const pgCtl = findBinary('pg_ctl')!;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-pg-'));
  const dataDir = path.join(dir, 'data');
  if (isRoot()) execFileSync('chown', ['postgres:', dir]);
  try {
    runServerProgram(initdb, [
      '-D',
      dataDir,
      '--auth=trust',
      '-U',
      'postgres',
      '--locale=C',
      '-E',
      'UTF8',
      '--no-sync',
    ]);
    const port = await freePort();
    const options = `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off -c max_connections=200`;
    runServerProgram(pgCtl, ['-D', dataDir, '-o', options, '-l', path.join(dir, 'log'), '-w', '-t', '60', 'start']);
    let stopped = false;
    return {
      adminUrl: `postgres://postgres@127.0.0.1:${port}/postgres`,
      dir,
      stop() {
        if (stopped) return;
        stopped = true;
        try {
          runServerProgram(pgCtl, ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
        } finally {
          fs.rmSync(dir, { recursive: true, force: true });
        }
      },
    };
  } catch (err) {
    const log = path.join(dir, 'log');
    const tail = fs.existsSync(log) ? fs.readFileSync(log, 'utf8').slice(-2000) : '';
    fs.rmSync(dir, { recursive: true, force: true });
    const stderr = (err as { stderr?: Buffer }).stderr?.toString() ?? '';
    throw new Error(`PostgreSQL test cluster failed to start: ${(err as Error).message}\n${stderr}\n${tail}`, {
      cause: err,
    });
  }
}
