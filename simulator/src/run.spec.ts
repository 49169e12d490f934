import { Aedes } from 'aedes';
import { connectAsync } from 'mqtt';
import { createServer, type AddressInfo, type Server } from 'node:net';
import { parseReadingPayload, type BatteryReading } from '@cellwarden/shared';
import { run, RunDeps } from './run';

const device = { id: 'cw-test-rig', secret: 'rig-secret-42' };
let broker: Aedes;
let server: Server;
let url: string;
const arrivals: { clientId: string; readings: BatteryReading[] }[] = [];
const refusedLogins: string[] = [];

beforeAll(async () => {
  broker = await Aedes.createBroker({
    authenticate(client, username, password, done) {
      const ok = username === device.id && password?.toString() === device.secret;
      if (!ok) refusedLogins.push(username ?? '');
      done(ok ? null : (Object.assign(new Error('bad credentials'), { returnCode: 4 }) as never), ok);
    },
  });
  broker.on('publish', (packet, client) => {
    if (!client) return;
    const { readings } = parseReadingPayload(packet.payload as Buffer, {
      now: Date.now(),
      expectedDeviceId: device.id,
    });
    arrivals.push({ clientId: client.id, readings });
  });
  server = createServer(broker.handle);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  url = `mqtt://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await new Promise<void>((resolve) => broker.close(() => resolve()));
  await new Promise<void>((resolve) => server.close(() => resolve()));
});

function deps(output: string[]): RunDeps {
  return {
    connect: (brokerUrl, options) => connectAsync(brokerUrl, { ...options, reconnectPeriod: 0 }),
    now: Date.now,
    stdout: (text) => output.push(text),
    stderr: (text) => output.push(text),
  };
}

it('delivers every reading of an offline window once, oldest first, after the monitor reconnects', async () => {
  arrivals.length = 0;
  const output: string[] = [];
  const start = Date.now() - 3 * 3600_000;
  const argv = ['--broker', url, '--device', `${device.id}:${device.secret}`, '--scenario', 'driving-day'];
  argv.push('--interval', '60', '--count', '90', '--start', new Date(start).toISOString());
  argv.push('--offline-every', '30', '--offline-for', '10');
  expect(await run(argv, deps(output))).toBe(0);

  const times = arrivals.flatMap((a) => a.readings.map((r) => r.measuredAt));
  // QoS 1 may deliver twice; what matters is one reading per measured time, all of them, in order.
  const distinct = [...new Set(times)];
  expect(distinct).toHaveLength(90);
  expect(distinct).toEqual([...distinct].sort((a, b) => a - b));
  expect(distinct[0]).toBe(start);
  expect(new Set(arrivals.map((a) => a.clientId))).toEqual(new Set([device.id]));
  const text = output.join('');
  expect(text.match(/offline at/g)).toHaveLength(2);
  expect(text).toContain('sending 10 buffered readings');
  // The readings measured in the first window (minutes 30–39) arrive together, after the reconnect.
  const backlog = arrivals
    .find((a) => a.readings.length > 1)
    ?.readings.map((r) => (r.measuredAt - start) / 60_000);
  expect(backlog).toEqual([30, 31, 32, 33, 34, 35, 36, 37, 38, 39, 40]);
});

it("uses a scenario's own offline schedule when the command line gives none", async () => {
  arrivals.length = 0;
  const output: string[] = [];
  const start = Date.now() - 4 * 3600_000;
  const argv = ['--broker', url, '--device', `${device.id}:${device.secret}`, '--scenario', 'phantom-drain'];
  argv.push('--interval', '60', '--count', '150', '--start', new Date(start).toISOString());
  expect(await run(argv, deps(output))).toBe(0);
  expect(output.join('')).toContain(`offline at ${new Date(start + 120 * 60_000).toISOString()}`);
  expect(new Set(arrivals.flatMap((a) => a.readings.map((r) => r.measuredAt))).size).toBe(150);
});

it('sends an unpaced run of a set count in packs, each reading with its own time', async () => {
  arrivals.length = 0;
  const start = Date.now() - 3600_000;
  const argv = ['--broker', url, '--device', `${device.id}:${device.secret}`, '--scenario', 'driving-day'];
  argv.push('--interval', '10', '--count', '45', '--start', new Date(start).toISOString());
  expect(await run(argv, deps([]))).toBe(0);
  expect(arrivals.map((a) => a.readings.length)).toEqual([20, 20, 5]);
  expect(arrivals.flatMap((a) => a.readings.map((r) => (r.measuredAt - start) / 10_000))).toEqual(
    Array.from({ length: 45 }, (_, i) => i),
  );
});

it('refuses a bad argument with exit code 2 and a message naming it', async () => {
  const output: string[] = [];
  expect(await run(['--device', 'a:b', '--interval', 'soon'], deps(output))).toBe(2);
  expect(output.join('')).toContain('--interval must be a number of seconds above 0; got "soon"');
});

it('reports a refused connection with exit code 1', async () => {
  const output: string[] = [];
  const code = await run(['--broker', url, '--device', `${device.id}:wrong`, '--count', '1'], deps(output));
  expect(code).toBe(1);
  expect(output.join('')).toContain('simulator stopped');
  expect(refusedLogins).toContain(device.id);
});
