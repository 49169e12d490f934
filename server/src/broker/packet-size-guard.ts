import { Duplex } from 'node:stream';
import type { Socket } from 'node:net';
import { MAX_READING_PAYLOAD_BYTES } from '@cellwarden/shared';

/**
 * Largest MQTT packet read at all, bytes: twice the payload limit. A payload a little over the limit is
 * still read and refused with its code (acknowledged, so the device does not resend it); a packet over this
 * closes the connection before its body is buffered, so no connection holds more than 128 KiB.
 */
export const MAX_MQTT_PACKET_BYTES = 2 * MAX_READING_PAYLOAD_BYTES;

/**
 * Reads MQTT fixed headers as bytes pass and says when a packet announces more than the limit, before its
 * body is read. Remaining Length is a variable byte integer of at most four bytes (MQTT 3.1.1 §2.2.3).
 */
export function createPacketSizeCheck(limit: number) {
  let state: 'type' | 'length' | 'body' = 'type';
  let length = 0;
  let multiplier = 1;
  let lengthBytes = 0;
  let bodyLeft = 0;
  /** Feeds bytes; returns false once a packet is over the limit or its header is malformed. */
  return (chunk: Buffer): boolean => {
    let i = 0;
    while (i < chunk.length) {
      if (state === 'body') {
        const skip = Math.min(bodyLeft, chunk.length - i);
        bodyLeft -= skip;
        i += skip;
        if (bodyLeft === 0) state = 'type';
        continue;
      }
      const byte = chunk[i++];
      if (state === 'type') {
        state = 'length';
        length = 0;
        multiplier = 1;
        lengthBytes = 0;
        continue;
      }
      length += (byte & 0x7f) * multiplier;
      multiplier *= 128;
      lengthBytes++;
      if (length > limit) return false;
      if (byte & 0x80) {
        if (lengthBytes === 4) return false; // MQTT-2.2.3: at most four length bytes
        continue;
      }
      bodyLeft = length;
      state = bodyLeft === 0 ? 'type' : 'body';
    }
    return true;
  };
}

/**
 * The TCP socket as aedes sees it, with packets over the limit refused before they are buffered: the
 * connection closes as soon as a fixed header announces too many bytes (aedes itself reads a whole
 * packet into memory before any size could be checked).
 */
export class PacketSizeGuard extends Duplex {
  readonly remoteAddress: string | undefined;

  constructor(
    private readonly socket: Socket,
    limit: number = MAX_MQTT_PACKET_BYTES,
    onRefused: () => void = () => undefined,
  ) {
    super();
    this.remoteAddress = socket.remoteAddress;
    const withinLimit = createPacketSizeCheck(limit);
    socket.on('data', (chunk: Buffer) => {
      if (!withinLimit(chunk)) {
        onRefused();
        socket.destroy();
        this.destroy();
        return;
      }
      if (!this.push(chunk)) socket.pause();
    });
    socket.on('end', () => this.push(null));
    socket.on('error', (error) => this.destroy(error));
    socket.on('close', () => this.destroy());
  }

  override _read(): void {
    this.socket.resume();
  }

  override _write(chunk: Buffer, _encoding: BufferEncoding, callback: (error?: Error | null) => void): void {
    this.socket.write(chunk, callback);
  }

  // mqtt-packet writes a PUBACK as three small writes under cork: without this they would reach the socket one
  // by one, three system calls per acknowledgement (the largest native cost in the server's profile).
  override _writev(
    chunks: { chunk: Buffer; encoding: BufferEncoding }[],
    callback: (error?: Error | null) => void,
  ): void {
    if (chunks.length === 1) this.socket.write(chunks[0].chunk, callback);
    else this.socket.write(Buffer.concat(chunks.map((c) => c.chunk)), callback);
  }

  override _final(callback: (error?: Error | null) => void): void {
    this.socket.end(callback);
  }

  override _destroy(error: Error | null, callback: (error?: Error | null) => void): void {
    this.socket.destroy();
    callback(error);
  }
}
