// A project-local PostgreSQL cluster on loopback: found or installed from Debian's packages,
// created in an ignored data folder, started on a project port. Node built-ins only, because
// it runs before (and independently of) node_modules.
import { execFileSync, spawnSync } from 'node:child_process';
import {
  appendFileSync,
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  rmSync,
  writeFileSync,
  chmodSync,
  statSync,
} from 'node:fs';
import { dirname, join, resolve } from 'node:path';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const SERVICE_USER = 'postgres';

/** Directory holding initdb/pg_ctl/postgres, newest major version first; undefined when absent. */
export function findServerBinaries() {
  const base = '/usr/lib/postgresql';
  if (existsSync(base)) {
    const versions = readdirSync(base)
      .filter((v) => existsSync(join(base, v, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    if (versions.length > 0) return join(base, versions[0], 'bin');
  }
  const which = spawnSync('sh', ['-c', 'command -v initdb'], { encoding: 'utf8' });
  const initdb = which.stdout.trim();
  return initdb ? dirname(initdb) : undefined;
}

/** Finds the server binaries, installing Debian's `postgresql` package when root and missing. */
export function ensureServerBinaries(log = console.log) {
  let bin = findServerBinaries();
  if (bin) return bin;
  if (!isRoot) {
    throw new Error(
      'PostgreSQL server binaries (initdb, pg_ctl) not found. Install them, e.g. `sudo apt-get install postgresql`, then run again.',
    );
  }
  log('PostgreSQL server not found: installing Debian package "postgresql" (apt-get)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'postgresql'], {
    stdio: 'inherit',
    env,
  });
  bin = findServerBinaries();
  if (!bin)
    throw new Error('apt-get installed postgresql but initdb was still not found under /usr/lib/postgresql');
  return bin;
}

function ensureServiceUser() {
  if (spawnSync('id', ['-u', SERVICE_USER]).status === 0) return;
  execFileSync('useradd', ['--system', '--no-create-home', '--shell', '/usr/sbin/nologin', SERVICE_USER]);
}

/** PostgreSQL refuses to run as root, so as root the server runs as the `postgres` system user. */
function runServerTool(bin, tool, args, options = {}) {
  const file = join(bin, tool);
  const [cmd, argv] = isRoot ? ['runuser', ['-u', SERVICE_USER, '--', file, ...args]] : [file, args];
  const result = spawnSync(cmd, argv, { encoding: 'utf8', ...options });
  return result;
}

function chownToServiceUser(path) {
  if (isRoot) execFileSync('chown', ['-R', `${SERVICE_USER}:`, path]);
}

/**
 * Describes one cluster. `dataDir` is absolute; the log file sits beside it. `replication: true` makes it a
 * primary that streaming replicas can copy and follow (see replica-cluster.mjs); off by default.
 * @param {{ dataDir: string, port: number, superuser: string, password: string, replication?: boolean }} options
 */
export function describeCluster(options) {
  const dataDir = resolve(options.dataDir);
  return { ...options, dataDir, logFile: `${dataDir}.log` };
}

function isInitialised(cluster) {
  return existsSync(join(cluster.dataDir, 'PG_VERSION'));
}

function initialise(bin, cluster, log) {
  log(`Creating PostgreSQL cluster in ${cluster.dataDir}`);
  rmSync(cluster.dataDir, { recursive: true, force: true });
  mkdirSync(cluster.dataDir, { recursive: true, mode: 0o700 });
  const pwfile = join(cluster.dataDir, '..', `.pwfile-${process.pid}`);
  writeFileSync(pwfile, `${cluster.password}\n`, { mode: 0o600 });
  if (isRoot) ensureServiceUser();
  chownToServiceUser(cluster.dataDir);
  chownToServiceUser(pwfile);
  try {
    const result = runServerTool(bin, 'initdb', [
      '-D',
      cluster.dataDir,
      '-U',
      cluster.superuser,
      `--pwfile=${pwfile}`,
      '--auth-host=scram-sha-256',
      '--auth-local=scram-sha-256',
      '-E',
      'UTF8',
      '--no-locale',
    ]);
    if (result.status !== 0) throw new Error(`initdb failed:\n${result.stdout}\n${result.stderr}`);
  } finally {
    rmSync(pwfile, { force: true });
  }
}

// The superuser may open a replication connection over loopback (pg_basebackup, a standby's WAL stream).
function allowReplication(cluster) {
  const hba = join(cluster.dataDir, 'pg_hba.conf');
  const entry = `host replication ${cluster.superuser} 127.0.0.1/32 scram-sha-256`;
  if (!readFileSync(hba, 'utf8').includes(entry)) appendFileSync(hba, `${entry}\n`);
}

function isRunning(bin, cluster) {
  return runServerTool(bin, 'pg_ctl', ['-D', cluster.dataDir, 'status']).status === 0;
}

/** Creates (when new) and starts the cluster; returns quickly when it is already up. */
export function startCluster(cluster, log = console.log) {
  const bin = ensureServerBinaries(log);
  if (!isInitialised(cluster)) initialise(bin, cluster, log);
  if (isRunning(bin, cluster)) return { bin, alreadyRunning: true };
  if (!existsSync(cluster.logFile)) writeFileSync(cluster.logFile, '');
  chownToServiceUser(cluster.logFile);
  const serverOptions = [
    `-p ${cluster.port}`,
    "-c listen_addresses='127.0.0.1'",
    `-c unix_socket_directories='${cluster.dataDir}'`,
    '-c fsync=on',
    // Said explicitly for a primary, so a changed default or a conf edit cannot turn streaming off.
    ...(cluster.replication ? ['-c wal_level=replica', '-c max_wal_senders=10'] : []),
  ].join(' ');
  if (cluster.replication) allowReplication(cluster);
  const result = runServerTool(bin, 'pg_ctl', [
    '-D',
    cluster.dataDir,
    '-l',
    cluster.logFile,
    '-o',
    serverOptions,
    '-w',
    '-t',
    '60',
    'start',
  ]);
  if (result.status !== 0) {
    const tail = existsSync(cluster.logFile)
      ? readFileSync(cluster.logFile, 'utf8').split('\n').slice(-15).join('\n')
      : '';
    throw new Error(`PostgreSQL did not start on 127.0.0.1:${cluster.port}:\n${result.stderr}\n${tail}`);
  }
  return { bin, alreadyRunning: false };
}

/** Creates the database when missing, connecting over the cluster's own socket as its superuser. */
export function ensureDatabase(cluster, database) {
  const bin = ensureServerBinaries();
  const psql = (sql, db = 'postgres') =>
    runServerTool(
      bin,
      'psql',
      [
        '-h',
        cluster.dataDir,
        '-p',
        String(cluster.port),
        '-U',
        cluster.superuser,
        '-d',
        db,
        '-v',
        'ON_ERROR_STOP=1',
        '-tAc',
        sql,
      ],
      {
        env: { ...process.env, PGPASSWORD: cluster.password },
      },
    );
  const found = psql(`SELECT 1 FROM pg_database WHERE datname = '${database.replace(/'/g, "''")}'`);
  if (found.status !== 0) throw new Error(`Could not query the cluster: ${found.stderr}`);
  if (found.stdout.trim() === '1') return false;
  const created = psql(`CREATE DATABASE "${database.replace(/"/g, '""')}"`);
  if (created.status !== 0) throw new Error(`CREATE DATABASE ${database} failed: ${created.stderr}`);
  return true;
}

/** Stops the cluster (fast shutdown: open sessions are ended, committed work is kept). */
export function stopCluster(cluster, mode = 'fast') {
  const bin = findServerBinaries();
  if (!bin || !isInitialised(cluster)) return;
  runServerTool(bin, 'pg_ctl', ['-D', cluster.dataDir, '-m', mode, '-w', 'stop']);
}

/** Removes the cluster's data folder and log (stopping it first). */
export function destroyCluster(cluster) {
  stopCluster(cluster, 'immediate');
  rmSync(cluster.dataDir, { recursive: true, force: true });
  rmSync(cluster.logFile, { force: true });
}

/**
 * Makes the data folder traversable by the service user. As root, the folders above it get search permission
 * for others where they lack it (execute only, never read: nothing in them can be listed), since a project
 * checked out under a private folder such as /root or a `mktemp -d` folder is otherwise out of the
 * `postgres` user's reach.
 */
export function prepareDataRoot(path) {
  mkdirSync(path, { recursive: true });
  chmodSync(path, 0o755);
  if (!isRoot) return;
  for (let dir = dirname(resolve(path)); dir !== dirname(dir); dir = dirname(dir)) {
    const mode = statSync(dir).mode;
    if ((mode & 0o001) === 0) {
      console.log(`Letting the postgres user pass through ${dir} (search permission only)`);
      chmodSync(dir, (mode & 0o7777) | 0o001);
    }
  }
}
