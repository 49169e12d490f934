import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { TEST_JWT_SECRET } from './test-secret';

const projectRoot = join(__dirname, '..', '..');

/**
 * A port that was free a moment ago on loopback; fixed ports let a device reconnect after a restart. Drawn
 * below Linux's ephemeral range (32768 and up), so an outgoing connection of another process on a busy
 * machine cannot take it between this probe and the server's listen.
 */
export async function freePort(): Promise<number> {
  for (let tries = 0; tries < 50; tries++) {
    const port = 20000 + Math.floor(Math.random() * 12000);
    const free = await new Promise<boolean>((resolve) => {
      const probe = createServer();
      probe.once('error', () => resolve(false));
      probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
    });
    if (free) return port;
  }
  throw new Error('no free port found below the ephemeral range');
}

/** Options of a server run as its own process. */
export interface ProcessServerOptions {
  databaseUrl: string;
  httpPort: number;
  mqttPort: number;
  env?: Record<string, string>;
}

/**
 * The real `server/src/main.ts` in a child process, restartable on the same ports. It runs in its own
 * process group because tsx starts node as a grandchild: a SIGKILL must reach the whole group.
 */
export function createProcessServer(options: ProcessServerOptions) {
  let child: ChildProcess | undefined;
  let exited: Promise<void> = Promise.resolve();
  let output = '';
  const baseUrl = `http://127.0.0.1:${options.httpPort}`;

  function start(): void {
    if (child) throw new Error('server process already running');
    const started = spawn(join(projectRoot, 'node_modules/.bin/tsx'), ['server/src/main.ts'], {
      cwd: projectRoot,
      detached: true,
      stdio: ['ignore', 'pipe', 'pipe'],
      env: {
        ...process.env,
        DATABASE_URL: options.databaseUrl,
        HOST: '127.0.0.1',
        PORT: String(options.httpPort),
        MQTT_PORT: String(options.mqttPort),
        WEB_DIST: '',
        LOG_LEVEL: 'warn',
        JWT_SECRET: TEST_JWT_SECRET,
        ...options.env,
      },
    });
    const keep = (chunk: Buffer) => (output = (output + chunk.toString()).slice(-20000));
    started.stdout!.on('data', keep);
    started.stderr!.on('data', keep);
    // Detached children outlive their parent: should the test process end first, take the group with it.
    const orphanGuard = () => killGroup(started.pid, 'SIGKILL');
    process.once('exit', orphanGuard);
    started.once('exit', () => process.removeListener('exit', orphanGuard));
    exited = new Promise((resolve) =>
      started.once('exit', () => {
        if (child === started) child = undefined;
        resolve();
      }),
    );
    child = started;
  }

  async function signalGroup(signal: NodeJS.Signals): Promise<void> {
    const running = child;
    if (!running?.pid) return;
    killGroup(running.pid, signal);
    await exited;
    child = undefined;
  }

  return {
    baseUrl,
    mqttUrl: `mqtt://127.0.0.1:${options.mqttPort}`,
    start,
    /** Resolves once GET /api/health answers at all (200 or 503), or fails with the process's output. */
    async ready(timeoutMs = 30000): Promise<void> {
      const deadline = Date.now() + timeoutMs;
      while (Date.now() < deadline) {
        if (!child) throw new Error(`server process exited:\n${output}`);
        const status = await healthStatus(baseUrl);
        if (status !== 0) return;
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
      throw new Error(`server process not ready in ${timeoutMs} ms:\n${output}`);
    },
    /** kill -9: no shutdown hooks run, nothing in memory survives. */
    kill: () => signalGroup('SIGKILL'),
    /** A graceful stop (SIGTERM), as a service manager would. */
    stop: () => signalGroup('SIGTERM'),
    output: () => output,
  };
}

function killGroup(pid: number | undefined, signal: NodeJS.Signals): void {
  if (!pid) return;
  try {
    process.kill(-pid, signal);
  } catch {
    // Already gone: nothing to signal.
  }
}

/** The status GET /api/health answers with, or 0 when nothing answers. */
export async function healthStatus(baseUrl: string): Promise<number> {
  try {
    const response = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(2000) });
    await response.arrayBuffer();
    return response.status;
  } catch {
    return 0;
  }
}

export type ProcessServer = ReturnType<typeof createProcessServer>;
