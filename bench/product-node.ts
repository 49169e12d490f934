import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { createServer, type AddressInfo } from 'node:net';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import demo from '../db/seeders/demo-sign-ins.json';

const root = join(__dirname, '..');

/** A free loopback port (asked of the kernel, then released for the child to take). */
export async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

async function waitForHealth(baseUrl: string, child: ChildProcess, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the server exited (${child.exitCode}) before it was ready`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`the server at ${baseUrl} was not ready within ${timeoutMs} ms`);
}

export interface ProductNode {
  baseUrl: string;
  mqttUrl: string;
  httpPort: number;
  mqttPort: number;
  /** SIGTERM, as a service manager restarting it would; resolves once it has exited. */
  stop(): Promise<void>;
  child: ChildProcess;
}

const JWT_SECRET = randomBytes(32).toString('hex');

/** The real server as its own process (`tsx server/src/main.ts`), so its CPU is not the load generator's. */
export async function startProduct(options: {
  databaseUrl: string;
  httpPort?: number;
  mqttPort?: number;
  profileDir?: string;
}): Promise<ProductNode> {
  const httpPort = options.httpPort ?? (await freePort());
  const mqttPort = options.mqttPort ?? (await freePort());
  const profiling = options.profileDir ? ['--cpu-prof', '--cpu-prof-dir', options.profileDir] : [];
  const child = spawn(process.execPath, ['--import', 'tsx', ...profiling, 'server/src/main.ts'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env,
      DATABASE_URL: options.databaseUrl,
      HOST: '127.0.0.1',
      PORT: String(httpPort),
      MQTT_PORT: String(mqttPort),
      JWT_SECRET,
      LOG_LEVEL: 'error',
      WEB_DIST: join(root, 'dist', 'web', 'browser'),
      SIGN_IN_LIMIT_PER_ADDRESS: '100000',
    },
  });
  const baseUrl = `http://127.0.0.1:${httpPort}`;
  await waitForHealth(baseUrl, child);
  return {
    baseUrl,
    mqttUrl: `mqtt://127.0.0.1:${mqttPort}`,
    httpPort,
    mqttPort,
    child,
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 15_000);
      await exited;
      clearTimeout(timer);
    },
  };
}

/** Signs in as the demo owner; returns the access token. */
export async function signIn(baseUrl: string): Promise<string> {
  const owner = demo.users[0];
  const response = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: owner.email, password: demo.password }),
  });
  if (!response.ok) throw new Error(`sign-in answered ${response.status}`);
  return ((await response.json()) as { accessToken: string }).accessToken;
}

export interface Monitor {
  systemId: string;
  deviceId: string;
  secret: string;
}

/** `count` systems of the demo owner, each with one monitor added through the API (so its secret is real). */
export async function createFleet(sequelize: Sequelize, baseUrl: string, count: number): Promise<Monitor[]> {
  const systemIds = await sequelize.query<{ id: string }>(
    `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id)
     SELECT 'Bench ' || n, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id
     FROM (SELECT * FROM systems ORDER BY created_at LIMIT 1) s, generate_series(1, :count) n RETURNING id`,
    { replacements: { count }, type: QueryTypes.SELECT },
  );
  const token = await signIn(baseUrl);
  const monitors: Monitor[] = [];
  const queue = systemIds.map((s, i) => ({ systemId: s.id, deviceId: `bench-monitor-${i}` }));
  await Promise.all(
    Array.from({ length: 8 }, async () => {
      for (let next = queue.shift(); next; next = queue.shift()) {
        const response = await fetch(`${baseUrl}/api/systems/${next.systemId}/devices`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
          body: JSON.stringify({ id: next.deviceId, label: 'bench monitor' }),
        });
        if (response.status !== 201) throw new Error(`adding a device answered ${response.status}`);
        const { mqttPassword } = (await response.json()) as { mqttPassword: string };
        monitors.push({ ...next, secret: mqttPassword });
      }
    }),
  );
  return monitors.sort((a, b) => a.deviceId.localeCompare(b.deviceId, 'en', { numeric: true }));
}
