import { EventEmitter } from 'node:events';
import type { Socket } from 'node:net';
import { PacketSizeGuard } from './packet-size-guard';

/** A socket that records each write it is asked for. */
function recordingSocket() {
  const writes: Buffer[] = [];
  const socket = Object.assign(new EventEmitter(), {
    remoteAddress: '192.0.2.7',
    write(chunk: Buffer, callback?: () => void) {
      writes.push(Buffer.from(chunk));
      if (callback) setImmediate(callback);
      return true;
    },
    pause: () => undefined,
    resume: () => undefined,
    destroy: () => undefined,
    end: (callback?: () => void) => callback?.(),
  });
  return { socket: socket as unknown as Socket, writes };
}

describe('PacketSizeGuard', () => {
  it('passes what is written under cork to the socket in one write (a PUBACK is three small writes)', async () => {
    const { socket, writes } = recordingSocket();
    const guard = new PacketSizeGuard(socket);
    guard.cork();
    // MQTT 3.1.1 §3.4: PUBACK is 0x40, remaining length 2, packet identifier 0x0107.
    guard.write(Buffer.from([0x40]));
    guard.write(Buffer.from([0x02]));
    guard.write(Buffer.from([0x01, 0x07]));
    guard.uncork();
    await new Promise((resolve) => setImmediate(resolve));
    expect(writes).toEqual([Buffer.from([0x40, 0x02, 0x01, 0x07])]);
  });

  it('passes a single write on as it is', async () => {
    const { socket, writes } = recordingSocket();
    const guard = new PacketSizeGuard(socket);
    guard.write(Buffer.from([0xd0, 0x00]));
    await new Promise((resolve) => setImmediate(resolve));
    expect(writes).toEqual([Buffer.from([0xd0, 0x00])]);
  });

  it('closes the connection when a fixed header announces more than the limit', () => {
    const { socket } = recordingSocket();
    let refused = 0;
    const destroyed = jest.spyOn(socket, 'destroy');
    new PacketSizeGuard(socket, 100, () => refused++);
    // PUBLISH with a remaining length of 200 (0xc8 0x01), over the 100-byte limit.
    socket.emit('data', Buffer.from([0x30, 0xc8, 0x01]));
    expect({ refused, destroyed: destroyed.mock.calls.length > 0 }).toEqual({ refused: 1, destroyed: true });
  });
});
