import type { IncomingMessage, Server } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import type { AccountsService, PublicUser } from '../accounts/accounts-service';
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
  systemIds: Set<string>;
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

  function send(client: StreamClient, message: unknown) {
    if (client.socket.readyState === client.socket.OPEN) client.socket.send(JSON.stringify(message));
  }

  function onConnection(socket: WebSocket, user: PublicUser) {
    const client: StreamClient = { socket, user, systemIds: new Set(), alive: true };
    clients.add(client);
    socket.on('pong', () => (client.alive = true));
    socket.on('error', (error) => deps.logger.debug('stream socket error', { error: error.message }));
    socket.on('close', () => clients.delete(client));
    socket.on('message', (data) => void onMessage(client, data.toString()));
  }

  async function onMessage(client: StreamClient, text: string) {
    let message: { type?: unknown; systemIds?: unknown };
    try {
      message = JSON.parse(text);
    } catch {
      return send(client, {
        type: 'error',
        error: { code: 'malformed_json', message: 'Message is not valid JSON' },
      });
    }
    if (
      message?.type !== 'subscribe' ||
      !Array.isArray(message.systemIds) ||
      message.systemIds.length > 500
    ) {
      return send(client, {
        type: 'error',
        error: {
          code: 'invalid_message',
          message: 'Expected {"type":"subscribe","systemIds":[…]} with at most 500 ids',
          field: 'type',
        },
      });
    }
    const allowed = new Set<string>();
    for (const id of message.systemIds) {
      try {
        if (typeof id === 'string') allowed.add((await deps.systems.getFor(client.user, id)).id);
      } catch {
        send(client, {
          type: 'error',
          error: { code: 'not_found', message: `System ${JSON.stringify(id)} not found` },
        });
      }
    }
    client.systemIds = allowed;
    send(client, { type: 'subscribed', systemIds: [...allowed] });
  }

  const unsubscribe = deps.hub.subscribe(({ systemId, reading }) => {
    for (const client of clients) {
      if (!client.systemIds.has(systemId) || client.socket.bufferedAmount > SLOW_CLIENT_BYTES) continue;
      send(client, { type: 'reading', systemId, reading });
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

  return {
    close() {
      clearInterval(heartbeat);
      unsubscribe();
      for (const client of clients) client.socket.terminate();
      wss.close();
    },
  };
}
