import type { MqttClient } from 'mqtt';
import { decodeReadingPack } from '@cellwarden/shared';
import { publishDevice, PublisherDeps } from './device-publisher';
import { SCENARIOS } from './scenario-catalog';
import { simulateReadings } from './simulate-readings';

const device = { id: 'cw-bench', secret: 's', seed: 3, scenario: 'phantom-drain' };

// A fake clock and broker: sleeping advances the clock, publishing records what was sent and when.
function bench() {
  let clock = Date.UTC(2026, 0, 10, 12);
  const sent: { at: number; measuredAt: number[]; voltages: number[] }[] = [];
  const options: unknown[] = [];
  const client = {
    publishAsync: async (_topic: string, payload: string) => {
      const { readings } = decodeReadingPack(JSON.parse(payload), { now: clock + 600_000 });
      sent.push({
        at: clock,
        measuredAt: readings.map((r) => r.measuredAt),
        voltages: readings.map((r) => r.voltage),
      });
    },
    endAsync: async () => undefined,
    on: () => client,
  } as unknown as MqttClient;
  const deps: PublisherDeps = {
    connect: async (_url, connectOptions) => (options.push(connectOptions), client),
    now: () => clock,
    sleep: async (ms) => void (clock += ms),
    stdout: () => undefined,
  };
  return { deps, sent, options, start: () => clock };
}

describe('publishDevice', () => {
  it('paces a run at --speed and never sends a reading before its measured time', async () => {
    const { deps, sent, start } = bench();
    const simStart = start() - 3600_000;
    const schedule = { broker: 'mqtt://x', start: simStart, intervalSeconds: 60, count: 90, speed: 60 };
    await publishDevice(deps, device, SCENARIOS['phantom-drain'], schedule);
    expect(sent).toHaveLength(90);
    // 60 simulated seconds per real second while catching up; then real time, as the hour of backlog runs out.
    expect(sent[10].at - sent[0].at).toBe(10_000);
    for (const s of sent) expect(s.at).toBeGreaterThanOrEqual(s.measuredAt[0]);
    expect(sent[89].at).toBe(sent[89].measuredAt[0]);
  });

  it('connects with a stable client id and a persistent session', async () => {
    const { deps, options } = bench();
    await publishDevice(deps, device, SCENARIOS['phantom-drain'], {
      broker: 'mqtt://x',
      start: 0,
      intervalSeconds: 60,
      count: 1,
    });
    expect(options[0]).toMatchObject({
      clientId: 'cw-bench',
      clean: false,
      username: 'cw-bench',
      password: 's',
    });
  });

  it('keeps trying with back-off when the first connect fails, as a real monitor does', async () => {
    const { deps, sent, start } = bench();
    const lines: string[] = [];
    let failures = 3;
    const connect = deps.connect;
    const begun = start();
    deps.stdout = (text) => void lines.push(text);
    deps.connect = async (url, options) => {
      if (failures-- > 0) throw new Error('connack timeout');
      return connect(url, options);
    };
    await publishDevice(deps, device, SCENARIOS['phantom-drain'], {
      broker: 'mqtt://x',
      start: 0,
      intervalSeconds: 60,
      count: 2,
    });
    expect(sent.length).toBeGreaterThan(0);
    expect(lines.filter((l) => l.includes('could not connect'))).toHaveLength(3);
    // 1 s, 2 s and 4 s of back-off on the fake clock before the fourth attempt succeeded.
    expect(start() - begun).toBe(7000);
  });

  it('resumes a stored timeline: the same readings as one continuous run, only those from now on sent live', async () => {
    const { deps, sent, start } = bench();
    const now = start();
    const origin = now - 3600_000;
    await publishDevice(deps, device, SCENARIOS['frost-night'], {
      broker: 'mqtt://x',
      start: origin,
      intervalSeconds: 60,
      count: 3,
      speed: 1,
      resumeAt: now,
    });
    const continuous = simulateReadings(SCENARIOS['frost-night'], {
      seed: device.seed,
      start: origin,
      intervalSeconds: 60,
      count: 63,
    }).readings.slice(60);
    expect(sent.flatMap((s) => s.measuredAt)).toEqual(continuous.map((r) => r.measuredAt));
    expect(sent.flatMap((s) => s.voltages)).toEqual(continuous.map((r) => r.voltage));
    // Each goes out when measured, not an hour of catching up later.
    expect(sent.map((s) => s.at)).toEqual(continuous.map((r) => r.measuredAt));
  });
});
