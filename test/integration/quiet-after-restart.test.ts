import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// A monitor that fell quiet before the node started sends nothing to wake the analytics for its system. The node
// finds such systems on its first silence sweep and flags them, judged from when their last reading arrived.

let node: Awaited<ReturnType<typeof startTestServer>>;
const cabin = demo.devices.find((d) => d.id === 'cw-demo-cabin')!;
const twoHoursAgo = Date.now() - 2 * 3600_000;

beforeAll(async () => {
  node = await startTestServer({
    env: { SILENCE_CHECK_SECONDS: '1' },
    beforeStart: async (database) => {
      const [{ id }] = await database.query<{ id: string }>(
        `SELECT system_id AS id FROM devices WHERE id = :id`,
        {
          replacements: { id: cabin.id },
          type: 'SELECT' as never,
        },
      );
      const reading = {
        measuredAt: twoHoursAgo,
        voltage: 26.1,
        current: -1.2,
        temperature: 4,
        stateOfCharge: 70,
      };
      await createReadingsRepository(database).insertBatch([{ systemId: id, deviceId: cabin.id, reading }]);
      await database.query(
        `UPDATE readings SET received_at = to_timestamp(:at / 1000.0) WHERE device_id = :id`,
        {
          replacements: { at: twoHoursAgo, id: cabin.id },
        },
      );
    },
  });
});
afterAll(async () => {
  await node.stop();
});

it('flags a system whose monitor went quiet before the node started', async () => {
  const { accessToken } = await signInAs(node.baseUrl, demo.users[0].email, demo.password);
  const auth = { Authorization: `Bearer ${accessToken}` };
  const systems = (await request(node.baseUrl).get('/api/systems').set(auth)).body.systems;
  const cabinId = systems.find((s: { kind: string }) => s.kind === 'cabin').id;
  const vanId = systems.find((s: { kind: string }) => s.kind === 'van').id;
  const active = async (id: string) =>
    (await request(node.baseUrl).get(`/api/systems/${id}/alerts`).query({ active: 'true' }).set(auth)).body
      .alerts as { kind: string; peakValue: number; unit: string }[];
  await until(async () => (await active(cabinId)).some((a) => a.kind === 'device-silent'), 15_000);
  const silent = (await active(cabinId)).find((a) => a.kind === 'device-silent')!;
  // Judged from when the last reading arrived (two hours ago), not from when this node started.
  expect(silent.unit).toBe('min');
  expect(silent.peakValue).toBeGreaterThan(110);
  // The van never reported at all: nothing to judge, nothing flagged.
  expect((await active(vanId)).map((a) => a.kind)).not.toContain('device-silent');
}, 30_000);
