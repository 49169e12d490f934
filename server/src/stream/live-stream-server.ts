import type { IncomingMessage, Server } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import {
  MAX_STREAM_SUBSCRIPTIONS,
  STREAM_CLOSE,
  STREAM_PROTOCOL,
  STREAM_TOKEN_PREFIX,
  type PublicUser,
  type StreamMessage,
} from '@cellwarden/shared';
import type { AccountsService } from '../accounts/accounts-service';
import type { SessionsRepository } from '../accounts/sessions-repository';
import { isUuid } from '../database/sql-values';
import type { Logger } from '../logger';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsHub } from '../telemetry/readings-hub';
import { MAX_STREAM_MESSAGE_BYTES, parseStreamRequest } from './stream-requests';

const STREAM_PATH = '/api/stream';
const HEARTBEAT_MS = 30000;
// A client whose socket has this much unsent is too slow: its readings are dropped, not queued.
const SLOW_CLIENT_BYTES = 1 << 20;
// Requests of one socket are handled one at a time; a client that sends faster than that is told so.
const MAX_PENDING_REQUESTS = 8;
const SWEEP_MS = 1000;

interface StreamClient {
  socket: WebSocket;
  user: PublicUser;
  sessionId: string;
  /** When the access token the socket runs on lapses, epoch ms. */
  tokenExpiresAt: number;
  /** Subscribed system ids, each with the instant the access decision behind it lapses. */
  subscriptions: Map<string, number>;
  alive: boolean;
  pending: number;
  queue: Promise<void>;
}

/** The browser's bearer token travels as a subprotocol, since browsers cannot set headers on a WebSocket. */
function tokenFromProtocols(header: string | undefined): string | undefined {
  const offered = (header ?? '').split(',').map((p) => p.trim());
  return offered.find((p) => p.startsWith(STREAM_TOKEN_PREFIX))?.slice(STREAM_TOKEN_PREFIX.length);
}

function refuseUpgrade(socket: Duplex, status: number, reason: string) {
  socket.end(`HTTP/1.1 ${status} ${reason}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
}

/**
 * Attaches the live stream to the HTTP server: the token checked at the upgrade (the same check as HTTP),
 * heartbeats, per-system subscriptions through the access policy, and a socket that ends with its token or
 * its sign-in session unless the client renews the token on it.
 */
export function attachLiveStream(deps: {
  server: Server;
  accounts: AccountsService;
  sessions: Pick<SessionsRepository, 'stillOpen'>;
  systems: SystemsService;
  hub: ReadingsHub;
  logger: Logger;
  now: () => number;
}) {
  const wss = new WebSocketServer({
    noServer: true,
    maxPayload: MAX_STREAM_MESSAGE_BYTES,
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
      (holder) => wss.handleUpgrade(req, socket, head, (ws) => onConnection(ws, holder)),
      () => refuseUpgrade(socket, 401, 'Unauthorized'),
    );
  });

  function send(client: StreamClient, message: StreamMessage) {
    if (client.socket.readyState === client.socket.OPEN) client.socket.send(JSON.stringify(message));
  }

  function onConnection(
    socket: WebSocket,
    holder: { user: PublicUser; sessionId: string; expiresAt: number },
  ) {
    const client: StreamClient = {
      socket,
      user: holder.user,
      sessionId: holder.sessionId,
      tokenExpiresAt: holder.expiresAt,
      subscriptions: new Map(),
      alive: true,
      pending: 0,
      queue: Promise.resolve(),
    };
    clients.add(client);
    socket.on('pong', () => (client.alive = true));
    socket.on('error', (error) => deps.logger.debug('stream socket error', { error: error.message }));
    socket.on('close', () => clients.delete(client));
    socket.on('message', (data) => enqueue(client, data.toString()));
  }

  function enqueue(client: StreamClient, text: string) {
    if (client.pending >= MAX_PENDING_REQUESTS)
      return send(client, {
        type: 'error',
        code: 'too_many_requests',
        message: `At most ${MAX_PENDING_REQUESTS} requests may wait; this one was dropped`,
      });
    client.pending++;
    client.queue = client.queue
      .then(() => onMessage(client, text))
      .catch((error) => deps.logger.warn('stream request failed', { error: String(error) }))
      .finally(() => client.pending--);
  }

  async function onMessage(client: StreamClient, text: string) {
    const parsed = parseStreamRequest(text);
    if (!parsed.ok) return send(client, { type: 'error', code: parsed.code, message: parsed.message });
    const request = parsed.request;
    if (request.type === 'renew') return renew(client, request.token);
    if (request.type === 'unsubscribe') {
      request.systemIds.forEach((id) => client.subscriptions.delete(id));
      return send(client, { type: 'subscribed', systemIds: [...client.subscriptions.keys()] });
    }
    await subscribe(client, [...new Set(request.systemIds)]);
  }

  async function renew(client: StreamClient, token: string) {
    try {
      const holder = await deps.accounts.authenticateToken(token);
      if (holder.user.id !== client.user.id) throw new Error('token of another person');
      Object.assign(client, {
        user: holder.user,
        sessionId: holder.sessionId,
        tokenExpiresAt: holder.expiresAt,
      });
      send(client, { type: 'renewed', expiresAt: holder.expiresAt });
    } catch {
      send(client, {
        type: 'error',
        code: 'renew_refused',
        message: 'token: not a valid token of this person',
      });
    }
  }

  /** Replaces the subscriptions with the systems named that the person may view (each asked of the policy). */
  async function subscribe(client: StreamClient, ids: string[]) {
    client.subscriptions.clear();
    const unknown: string[] = [];
    for (const id of ids.slice(0, MAX_STREAM_SUBSCRIPTIONS)) {
      if (!isUuid(id)) {
        unknown.push(id);
        continue;
      }
      try {
        const { system, access } = await deps.systems.openFor(client.user, id, 'view');
        client.subscriptions.set(system.id, access.validUntil);
      } catch {
        unknown.push(id);
      }
    }
    if (unknown.length > 0) {
      const named = unknown.slice(0, 10).map((id) => JSON.stringify(id));
      const more = unknown.length > 10 ? ` and ${unknown.length - 10} more` : '';
      const message = `System ${named.join(', ')}${more} not found`;
      send(client, { type: 'error', code: 'not_found', message });
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

  function close(client: StreamClient, code: number, reason: string) {
    clients.delete(client);
    client.socket.close(code, reason);
  }

  const unsubscribe = deps.hub.subscribe(({ systemId, message }) => {
    const now = deps.now();
    // Serialised once for every subscriber (and only if there is one), not once per socket.
    let frame: Buffer | undefined;
    for (const client of clients) {
      const validUntil = client.subscriptions.get(systemId);
      if (validUntil === undefined) continue;
      if (client.tokenExpiresAt <= now) continue; // closed by the next sweep, never fed meanwhile
      if (validUntil <= now) {
        client.subscriptions.set(systemId, Number.NEGATIVE_INFINITY);
        void recheck(client, systemId);
        continue;
      }
      // A slow client loses readings rather than slowing everyone else down.
      if (client.socket.bufferedAmount > SLOW_CLIENT_BYTES) continue;
      if (client.socket.readyState !== client.socket.OPEN) continue;
      frame ??= Buffer.from(JSON.stringify(message));
      client.socket.send(frame, { binary: false });
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

  // Every second: sockets whose token lapsed close; grants that lapsed are asked again; and one query
  // finds sessions that ended (on this node or another), whose sockets close too.
  let sessionCheck: Promise<void> | undefined;
  const sweep = setInterval(() => {
    const now = deps.now();
    for (const client of clients) {
      if (client.tokenExpiresAt <= now) {
        close(client, STREAM_CLOSE.tokenExpired, 'access token expired');
        continue;
      }
      for (const [systemId, validUntil] of client.subscriptions)
        if (validUntil <= now && validUntil !== Number.NEGATIVE_INFINITY) {
          client.subscriptions.set(systemId, Number.NEGATIVE_INFINITY);
          void recheck(client, systemId);
        }
    }
    if (clients.size > 0) sessionCheck ??= closeEndedSessions().finally(() => (sessionCheck = undefined));
  }, SWEEP_MS);
  sweep.unref();

  async function closeEndedSessions() {
    const open = [...clients];
    try {
      const stillOpen = await deps.sessions.stillOpen([...new Set(open.map((c) => c.sessionId))]);
      for (const client of open)
        if (!stillOpen.has(client.sessionId)) close(client, STREAM_CLOSE.sessionEnded, 'session ended');
    } catch (error) {
      deps.logger.debug('stream session check skipped', { error: String(error) });
    }
  }

  return {
    /** Called when a grant on the system was revoked: everyone subscribed to it is checked again now. */
    accessChanged(systemId: string) {
      for (const client of clients) if (client.subscriptions.has(systemId)) void recheck(client, systemId);
    },
    close() {
      clearInterval(heartbeat);
      clearInterval(sweep);
      unsubscribe();
      for (const client of clients) client.socket.terminate();
      wss.close();
    },
  };
}
