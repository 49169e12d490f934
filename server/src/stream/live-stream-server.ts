import type { IncomingMessage, Server } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import type { PublicUser, StreamMessage } from '@cellwarden/shared';
import type { AccountsService } from '../accounts/accounts-service';
import type { Logger } from '../logger';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsHub } from '../telemetry/readings-hub';

/** WebSocket subprotocol of Cellwarden's live stream, version 1. */
export const STREAM_PROTOCOL = 'cellwarden.v1';
const STREAM_PATH = '/api/stream';
const HEARTBEAT_MS = 30000;
// A client whose socket has this much unsent is too slow: its readings are dropped, not queued.
const SLOW_CLIENT_BYTES = 1 << 20;
const MAX_MESSAGE_BYTES = 16 * 1024;

interface StreamClient {
  socket: WebSocket;
  user: PublicUser;
  /** Subscribed system ids, each with the instant the access decision behind it lapses. */
  subscriptions: Map<string, number>;
  alive: boolean;
}

/** The browser's bearer token travels as a subprotocol, since browsers cannot set headers on a WebSocket. */
function tokenFromProtocols(header: string | undefined): string | undefined {
  const offered = (header ?? '').split(',').map((p) => p.trim());
  return offered.find((p) => p.startsWith('bearer.'))?.slice('bearer.'.length);
}

function refuseUpgrade(socket: Duplex, status: number, reason: string) {
  socket.end(`HTTP/1.1 ${status} ${reason}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
}

/** Attaches the live stream to the HTTP server: authenticated at the upgrade, heartbeats, per-system subscriptions. */
export function attachLiveStream(deps: {
  server: Server;
  accounts: AccountsService;
  systems: SystemsService;
  hub: ReadingsHub;
  logger: Logger;
  now: () => number;
}) {
  const wss = new WebSocketServer({
    noServer: true,
    maxPayload: MAX_MESSAGE_BYTES,
    handleProtocols: (protocols) => (protocols.has(STREAM_PROTOCOL) ? STREAM_PROTOCOL : false),
  });
  const clients = new Set<StreamClient>();

  deps.server.on('upgrade', (req: IncomingMessage, socket: Duplex, head: Buffer) => {
    socket.on('error', () => socket.destroy());
    if (new URL(req.url ?? '/', 'http://localhost').pathname !== STREAM_PATH)
      return refuseUpgrade(socket, 404, 'Not Found');
    const token = tokenFromProtocols(req.headers['sec-websocket-protocol']);
    if (!token) return refuseUpgrade(socket, 401, 'Unauthorized');
    deps.accounts.authenticateToken(token).then(
      (user) => wss.handleUpgrade(req, socket, head, (ws) => onConnection(ws, user)),
      () => refuseUpgrade(socket, 401, 'Unauthorized'),
    );
  });

  function send(client: StreamClient, message: StreamMessage) {
    if (client.socket.readyState === client.socket.OPEN) client.socket.send(JSON.stringify(message));
  }

  function onConnection(socket: WebSocket, user: PublicUser) {
    const client: StreamClient = { socket, user, subscriptions: new Map(), alive: true };
    clients.add(client);
    socket.on('pong', () => (client.alive = true));
    socket.on('error', (error) => deps.logger.debug('stream socket error', { error: error.message }));
    socket.on('close', () => clients.delete(client));
    socket.on('message', (data) => void onMessage(client, data.toString()));
  }

  const invalid = (client: StreamClient, message: string) =>
    send(client, { type: 'error', code: 'invalid_message', message });

  async function onMessage(client: StreamClient, text: string) {
    let message: { type?: unknown; systemIds?: unknown };
    try {
      message = JSON.parse(text);
    } catch {
      return send(client, { type: 'error', code: 'malformed_json', message: 'Message is not valid JSON' });
    }
    const ids = message?.systemIds;
    if (!Array.isArray(ids) || ids.length > 500 || !ids.every((id) => typeof id === 'string'))
      return invalid(
        client,
        'Expected {"type":"subscribe"|"unsubscribe","systemIds":[…]} with at most 500 ids',
      );
    if (message.type === 'unsubscribe') {
      ids.forEach((id) => client.subscriptions.delete(id));
      return send(client, { type: 'subscribed', systemIds: [...client.subscriptions.keys()] });
    }
    if (message.type !== 'subscribe') return invalid(client, 'type must be "subscribe" or "unsubscribe"');
    client.subscriptions.clear();
    for (const id of ids) {
      try {
        const { system, access } = await deps.systems.openFor(client.user, id, 'view');
        client.subscriptions.set(system.id, access.validUntil);
      } catch {
        send(client, { type: 'error', code: 'not_found', message: `System ${JSON.stringify(id)} not found` });
      }
    }
    send(client, { type: 'subscribed', systemIds: [...client.subscriptions.keys()] });
  }

  /** Asks the policy again; access that ended is dropped and the client told, at once. */
  async function recheck(client: StreamClient, systemId: string) {
    try {
      const { access } = await deps.systems.openFor(client.user, systemId, 'view');
      if (client.subscriptions.has(systemId)) client.subscriptions.set(systemId, access.validUntil);
    } catch {
      if (client.subscriptions.delete(systemId))
        send(client, { type: 'access-ended', systemIds: [systemId] });
    }
  }

  const unsubscribe = deps.hub.subscribe(({ systemId, message }) => {
    const now = deps.now();
    for (const client of clients) {
      const validUntil = client.subscriptions.get(systemId);
      if (validUntil === undefined) continue;
      if (validUntil <= now) {
        client.subscriptions.set(systemId, Number.NEGATIVE_INFINITY);
        void recheck(client, systemId);
        continue;
      }
      // A slow client loses readings rather than slowing everyone else down.
      if (client.socket.bufferedAmount > SLOW_CLIENT_BYTES) continue;
      send(client, message);
    }
  });

  const heartbeat = setInterval(() => {
    for (const client of clients) {
      if (!client.alive) {
        client.socket.terminate();
        continue;
      }
      client.alive = false;
      client.socket.ping();
    }
  }, HEARTBEAT_MS);
  heartbeat.unref();
  // Grants expire on their own; a sweep catches a lapsed one even on a system that is not reporting.
  const expirySweep = setInterval(() => {
    const now = deps.now();
    for (const client of clients)
      for (const [systemId, validUntil] of client.subscriptions)
        if (validUntil <= now && validUntil !== Number.NEGATIVE_INFINITY) {
          client.subscriptions.set(systemId, Number.NEGATIVE_INFINITY);
          void recheck(client, systemId);
        }
  }, 1000);
  expirySweep.unref();

  return {
    /** Called when a grant on the system was revoked: everyone subscribed to it is checked again now. */
    accessChanged(systemId: string) {
      for (const client of clients) if (client.subscriptions.has(systemId)) void recheck(client, systemId);
    },
    close() {
      clearInterval(heartbeat);
      clearInterval(expirySweep);
      unsubscribe();
      for (const client of clients) client.socket.terminate();
      wss.close();
    },
  };
}
