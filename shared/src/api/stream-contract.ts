// Messages of the live stream (WebSocket /api/stream, subprotocol cellwarden.v1 plus bearer.<token>).
import type { ReceivedReading } from './api-contract';
import type { AlertEvent, DerivedState } from './alerts-contract';

/** Client → server. */
export type StreamRequest =
  { type: 'subscribe'; systemIds: string[] } | { type: 'unsubscribe'; systemIds: string[] };

/** Server → client. */
export type StreamMessage =
  | { type: 'subscribed'; systemIds: string[] }
  | { type: 'reading'; systemId: string; reading: ReceivedReading; derived: DerivedState | null }
  | { type: 'alert'; systemId: string; alert: AlertEvent }
  /** Access to these systems ended (grant revoked or expired); the client stops showing them. */
  | { type: 'access-ended'; systemIds: string[] }
  | { type: 'error'; code: string; message: string };
