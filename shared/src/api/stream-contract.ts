// Messages of the live stream (WebSocket /api/stream, subprotocol cellwarden.v1 plus bearer.<token>).
import type { ReceivedReading } from './api-contract';
import type { AlertEvent, DerivedState } from './alerts-contract';

/** WebSocket subprotocol of Cellwarden's live stream, version 1. */
export const STREAM_PROTOCOL = 'cellwarden.v1';

/**
 * Prefix of the second subprotocol, which carries the access token (`bearer.<token>`): browsers cannot set
 * headers on a WebSocket.
 */
export const STREAM_TOKEN_PREFIX = 'bearer.';

/** Most systems one subscribe may name, and one connection may hold. */
export const MAX_STREAM_SUBSCRIPTIONS = 1000;

/** WebSocket close codes of the stream (RFC 6455 §7.4.2: 4000–4999 are the application's own). */
export const STREAM_CLOSE = {
  /** The access token lapsed and was not renewed on the socket; reconnect with a fresh one. */
  tokenExpired: 4001,
  /** The sign-in session ended (signed out, password or roles changed); sign in again. */
  sessionEnded: 4003,
} as const;

/** Client → server. */
export type StreamRequest =
  | { type: 'subscribe'; systemIds: string[] }
  | { type: 'unsubscribe'; systemIds: string[] }
  /** A fresh access token of the same person, so the open socket outlives the one it was opened with. */
  | { type: 'renew'; token: string };

/** Server → client. */
export type StreamMessage =
  | { type: 'subscribed'; systemIds: string[] }
  /** The socket now runs on the renewed token, until `expiresAt` (epoch ms). */
  | { type: 'renewed'; expiresAt: number }
  | { type: 'reading'; systemId: string; reading: ReceivedReading; derived: DerivedState | null }
  | { type: 'alert'; systemId: string; alert: AlertEvent }
  /** Access to these systems ended (grant revoked or expired); the client stops showing them. */
  | { type: 'access-ended'; systemIds: string[] }
  | { type: 'error'; code: string; message: string };
