import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Redis } from 'ioredis';
import { freePort } from './process-server';

/** A Redis for one test file: the suite's (CW_TEST_REDIS_URL) or a loopback redis-server of its own. */
export interface TestRedis {
  url: string;
  /** Empties every key, so a test starts without the sessions and counters of the one before. */
  flush(): Promise<void>;
  stop(): Promise<void>;
}

async function answersPing(url: string): Promise<boolean> {
  const probe = new Redis(url, { lazyConnect: true, maxRetriesPerRequest: 0, retryStrategy: () => null });
  probe.on('error', () => undefined);
  try {
    await probe.connect();
    return (await probe.ping()) === 'PONG';
  } catch {
    return false;
  } finally {
    probe.disconnect();
  }
}

async function flushAll(url: string): Promise<void> {
  const redis = new Redis(url);
  try {
    await redis.flushall();
  } finally {
    redis.disconnect();
  }
}

// Without `npm test` (e.g. a single jest project run), start one: loopback, no snapshots, a temp dir.
async function startOwnRedis(): Promise<TestRedis> {
  if (spawnSync('sh', ['-c', 'command -v redis-server']).status !== 0)
    throw new Error("Cluster tests need Debian's redis-server: run `apt-get install redis-server`.");
  const port = await freePort();
  const dir = mkdtempSync(join(tmpdir(), 'cw-redis-'));
  const args = [
    '--port',
    String(port),
    '--bind',
    '127.0.0.1',
    '--dir',
    dir,
    '--save',
    '',
    '--appendonly',
    'no',
  ];
  const child = spawn('redis-server', args, { stdio: 'ignore' });
  const url = `redis://127.0.0.1:${port}`;
  const deadline = Date.now() + 10000;
  while (!(await answersPing(url))) {
    if (Date.now() > deadline || child.exitCode !== null)
      throw new Error(`redis-server did not start on ${port}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return {
    url,
    flush: () => flushAll(url),
    async stop() {
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The suite's Redis when `npm test` started one, else a private redis-server stopped by `stop`. */
export async function useTestRedis(): Promise<TestRedis> {
  const shared = process.env.CW_TEST_REDIS_URL;
  if (!shared) return startOwnRedis();
  return { url: shared, flush: () => flushAll(shared), stop: async () => undefined };
}
