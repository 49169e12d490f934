// A streaming replica of a local-cluster.mjs primary (one started with `replication: true`): copied with
// pg_basebackup -R, which writes standby.signal and primary_conninfo, then started read-only on its own port.
// Node built-ins only, like local-cluster.mjs.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import {
  describeCluster,
  destroyCluster,
  ensureServerBinaries,
  startCluster,
  stopCluster,
} from './local-cluster.mjs';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

/**
 * Describes a replica of `primary` in `dataDir` on `port`; it follows the primary as the primary's superuser.
 * @param {{ port: number, superuser: string, password: string }} primary
 * @param {{ dataDir: string, port: number }} options
 */
export function describeReplica(primary, options) {
  const replica = describeCluster({ ...options, superuser: primary.superuser, password: primary.password });
  return { ...replica, primaryPort: primary.port };
}

function baseBackup(bin, replica, log) {
  log(`Copying the primary on 127.0.0.1:${replica.primaryPort} into ${replica.dataDir} (pg_basebackup)`);
  rmSync(replica.dataDir, { recursive: true, force: true });
  mkdirSync(replica.dataDir, { recursive: true, mode: 0o700 });
  // PostgreSQL runs as the postgres system user when we are root (see local-cluster.mjs), so it owns the copy.
  if (isRoot) execFileSync('chown', ['postgres:', replica.dataDir]);
  const args = ['-h', '127.0.0.1', '-p', String(replica.primaryPort), '-U', replica.superuser];
  const copy = [...args, '-D', replica.dataDir, '-R', '-X', 'stream', '-c', 'fast', '-w'];
  const tool = join(bin, 'pg_basebackup');
  const [cmd, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', tool, ...copy]] : [tool, copy];
  const result = spawnSync(cmd, argv, {
    encoding: 'utf8',
    env: { ...process.env, PGPASSWORD: replica.password },
    timeout: 120000,
  });
  if (result.status !== 0) {
    rmSync(replica.dataDir, { recursive: true, force: true });
    throw new Error(`pg_basebackup from port ${replica.primaryPort} failed:\n${result.stderr}`);
  }
}

/** Makes the replica when it has no data yet (the primary must be running), then starts it. */
export function startReplica(replica, log = console.log) {
  const bin = ensureServerBinaries(log);
  if (!existsSync(join(replica.dataDir, 'PG_VERSION'))) baseBackup(bin, replica, log);
  return startCluster(replica, log);
}

/** Stops the replica (fast shutdown); the primary goes on. */
export function stopReplica(replica) {
  stopCluster(replica, 'fast');
}

/** Stops the replica and removes its data folder and log. */
export function destroyReplica(replica) {
  destroyCluster(replica);
}
