import type { MonitorStatus } from '@cellwarden/shared';

/** What the waiting screen says about a monitor: a headline and what to check. */
export interface MonitorWords {
  tone: 'waiting' | 'arrived' | 'problem';
  headline: string;
  advice: string;
}

// The broker's stable codes, in the words an installer at the van door can act on.
const CODE_ADVICE: Record<string, string> = {
  bad_credentials:
    'The broker did not accept the device id and password. Check both were copied whole, without spaces.',
  client_id_rejected:
    'The MQTT client id must be the device id itself (or the device id, a slash and a suffix).',
  too_many_failed_connects:
    'After many wrong passwords the broker waits a minute before it listens to this device again.',
  foreign_topic: 'The monitor published to another topic. Use exactly the topic shown above.',
  payload_not_json: 'The payload was not JSON. Compare it with the example payload.',
  payload_too_large: 'The payload was over 64 KiB. Send one reading, or a few, per message.',
};

/** Words for the monitor's state: arrived, still waiting, or the most recent refusal and how to fix it. */
export function monitorWords(status: MonitorStatus | null): MonitorWords {
  if (status?.state === 'arrived')
    return {
      tone: 'arrived',
      headline: 'First reading arrived',
      advice: 'The monitor is connected and its readings are stored.',
    };
  const last = status?.refusals.last;
  if (status?.state === 'refused' && last) {
    const kind = {
      credentials: 'Refused: credentials',
      topic: 'Refused: wrong topic',
      payload: 'Refused: bad payload',
    }[last.kind];
    const fallback =
      last.kind === 'payload'
        ? `The reading was refused (${last.code}). Check the units (V, A, Cel) and the base name against the example.`
        : `The broker refused the monitor (${last.code}).`;
    return { tone: 'problem', headline: kind, advice: CODE_ADVICE[last.code] ?? fallback };
  }
  return {
    tone: 'waiting',
    headline: 'Waiting for the first reading',
    advice: 'Enter the details in the monitor, or send the example from a computer on the same network.',
  };
}
