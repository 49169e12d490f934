import type { MonitorStatus } from '@cellwarden/shared';
import { monitorWords } from './monitor-words';

const status = (over: Partial<MonitorStatus>): MonitorStatus => ({
  deviceId: 'van-shunt-1',
  state: 'waiting',
  lastSeenAt: null,
  latestReading: null,
  refusals: { credentials: 0, topic: 0, payload: 0, last: null },
  ...over,
});

describe('monitorWords', () => {
  it('says it is waiting before anything happened', () => {
    expect(monitorWords(status({})).tone).toBe('waiting');
    expect(monitorWords(null).headline).toBe('Waiting for the first reading');
  });

  it('says the first reading arrived, even after earlier refusals', () => {
    const words = monitorWords(
      status({
        state: 'arrived',
        refusals: {
          credentials: 3,
          topic: 0,
          payload: 0,
          last: { kind: 'credentials', code: 'bad_credentials', at: 1 },
        },
      }),
    );
    expect(words).toMatchObject({ tone: 'arrived', headline: 'First reading arrived' });
  });

  it('names refused credentials, a wrong topic and a bad payload with what to check', () => {
    const refused = (kind: 'credentials' | 'topic' | 'payload', code: string) =>
      monitorWords(
        status({
          state: 'refused',
          refusals: { credentials: 0, topic: 0, payload: 0, [kind]: 1, last: { kind, code, at: 1 } },
        }),
      );
    expect(refused('credentials', 'bad_credentials')).toMatchObject({
      tone: 'problem',
      headline: 'Refused: credentials',
      advice: expect.stringContaining('device id and password'),
    });
    expect(refused('topic', 'foreign_topic').advice).toContain('exactly the topic');
    expect(refused('payload', 'senml_unit_missing').advice).toContain('(senml_unit_missing)');
  });
});
