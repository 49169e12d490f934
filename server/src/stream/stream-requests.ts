import { MAX_STREAM_SUBSCRIPTIONS, type StreamRequest } from '@cellwarden/shared';
import { z } from 'zod';

/** Largest stream message, bytes: room for a subscribe naming MAX_STREAM_SUBSCRIPTIONS ids (36 chars each). */
export const MAX_STREAM_MESSAGE_BYTES = 64 * 1024;

const systemIds = z
  .array(z.string().max(64, 'each system id is at most 64 characters'), {
    error: 'systemIds must be an array of system ids',
  })
  .max(MAX_STREAM_SUBSCRIPTIONS, `systemIds may name at most ${MAX_STREAM_SUBSCRIPTIONS} systems`);

const streamRequest = z.discriminatedUnion(
  'type',
  [
    z.object({ type: z.literal('subscribe'), systemIds }),
    z.object({ type: z.literal('unsubscribe'), systemIds }),
    z.object({ type: z.literal('renew'), token: z.string({ error: 'token is required' }).min(1).max(4096) }),
  ],
  { error: 'type must be "subscribe", "unsubscribe" or "renew"' },
);

/** A stream message understood, or why not (code and a message naming the field). */
export type ParsedStreamRequest =
  | { ok: true; request: StreamRequest }
  | { ok: false; code: 'malformed_json' | 'invalid_message'; message: string };

/** Parses one client message of the live stream with the same zod conventions as the HTTP routes. */
export function parseStreamRequest(text: string): ParsedStreamRequest {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return { ok: false, code: 'malformed_json', message: 'Message is not valid JSON' };
  }
  const parsed = streamRequest.safeParse(json);
  if (parsed.success) return { ok: true, request: parsed.data };
  const issue = parsed.error.issues[0];
  const field = issue.path.join('.') || 'type';
  return { ok: false, code: 'invalid_message', message: `${field}: ${issue.message}` };
}
