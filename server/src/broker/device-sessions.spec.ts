import type { Client } from 'aedes';
import { createDeviceSessions } from './device-sessions';

const device = { deviceId: 'cw-unit-van', systemId: '7d1f6b8e-0000-4000-8000-000000000001' };

function setup(answers: (() => Promise<typeof device | undefined>)[]) {
  let clock = 1_000_000;
  const authenticate = jest.fn(() => answers.shift()!());
  const sessions = createDeviceSessions({ devices: { authenticate }, now: () => clock, recheckMs: 30_000 });
  const client = {} as Client;
  sessions.open(client, device, 'secret-1');
  return { sessions, client, authenticate, advance: (ms: number) => (clock += ms) };
}

describe('createDeviceSessions', () => {
  it('trusts a connection without asking again inside the recheck window', async () => {
    const { sessions, client, authenticate, advance } = setup([]);
    advance(29_999);
    expect(await sessions.current(client)).toEqual(device);
    expect(authenticate).not.toHaveBeenCalled();
  });

  it('drops a connection whose device was revoked once the window has passed', async () => {
    const { sessions, client, authenticate, advance } = setup([async () => undefined]);
    advance(30_000);
    expect(await sessions.current(client)).toBeUndefined();
    expect(authenticate).toHaveBeenCalledWith(device.deviceId, 'secret-1');
  });

  it('keeps a connection while the credential store cannot be reached', async () => {
    const { sessions, client, advance } = setup([() => Promise.reject(new Error('connection refused'))]);
    advance(60_000);
    expect(await sessions.current(client)).toEqual(device);
  });

  it('checks once for publishes that arrive together, then trusts the fresh answer', async () => {
    const { sessions, client, authenticate, advance } = setup([async () => device]);
    advance(45_000);
    const answers = await Promise.all([sessions.current(client), sessions.current(client)]);
    expect(answers).toEqual([device, device]);
    expect(await sessions.current(client)).toEqual(device);
    expect(authenticate).toHaveBeenCalledTimes(1);
  });

  it('knows nothing of a connection that never authenticated', async () => {
    const { sessions } = setup([]);
    expect(await sessions.current({} as Client)).toBeUndefined();
    expect(await sessions.current(null)).toBeUndefined();
  });
});
