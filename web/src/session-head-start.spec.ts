import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ReceivedReading, SystemStatus } from '@cellwarden/shared';
import { FLAG_KINDS, flagText } from './app/core/flag-text';
import { resolveLocale } from './app/core/locale';

// web/src/session-head-start.js runs before Angular, outside the module graph; here it runs in jsdom against a
// fetch that answers as the server would, and its first glance is read back from the page.

const SCRIPT = readFileSync(join(__dirname, 'session-head-start.js'), 'utf8');
const NOW = Date.UTC(2026, 11, 2, 20, 0, 0);

const reading = (over: Partial<ReceivedReading> = {}): ReceivedReading => ({
  measuredAt: NOW - 10_000,
  receivedAt: NOW - 9_000,
  voltage: 13.35,
  current: 9.5,
  temperature: 4,
  stateOfCharge: 58,
  ...over,
});
const status = (over: Partial<SystemStatus> = {}): SystemStatus => ({
  systemId: 'van-1',
  latestReading: reading(),
  derived: null,
  activeAlerts: [],
  monitors: [],
  ...over,
});
const SUMMARY = { id: 'van-1', name: 'Blue van', chemistry: 'lifepo4' };

type Answer = { status: number; body?: unknown } | 'offline';

/** Runs the script on /systems/van-1 with these answers; resolves once its requests are answered. */
async function run(answers: { status?: Answer; system?: Answer; languages?: string[] } = {}) {
  window.history.pushState({}, '', '/systems/van-1');
  Object.defineProperty(navigator, 'languages', {
    value: answers.languages ?? ['en-GB'],
    configurable: true,
  });
  const reply = (answer: Answer) =>
    answer === 'offline'
      ? Promise.reject(new TypeError('Failed to fetch'))
      : Promise.resolve({
          ok: answer.status >= 200 && answer.status < 300,
          status: answer.status,
          json: () => Promise.resolve(answer.body),
        });
  const fetch = jest.fn((url: string) => {
    if (url === '/api/auth/refresh') return reply({ status: 200, body: { accessToken: 'tok' } });
    if (url === '/api/systems/van-1/status')
      return reply(answers.status ?? { status: 200, body: { status: status() } });
    if (url === '/api/systems/van-1')
      return reply(answers.system ?? { status: 200, body: { system: SUMMARY } });
    throw new Error(`unexpected request ${url}`);
  });
  (window as unknown as { fetch: typeof fetch }).fetch = fetch;
  new Function(SCRIPT)();
  const held = window as unknown as { cwStatusHeadStart: { answer: Promise<unknown> } };
  await held.cwStatusHeadStart.answer.catch(() => undefined);
  // The paint waits for both answers; a few turns of the microtask queue let it through.
  for (let i = 0; i < 10; i++) await Promise.resolve();
  return fetch;
}

const glance = () => document.getElementById('cw-first-glance');
const text = () => glance()?.textContent?.replace(/\s+/g, ' ') ?? '';

describe('the first glance session-head-start.js paints', () => {
  beforeEach(() => jest.useFakeTimers({ now: NOW, doNotFake: ['queueMicrotask', 'nextTick'] }));
  afterEach(() => {
    glance()?.remove();
    jest.useRealTimers();
  });

  it('asks for the status and the description once each, with the renewed token', async () => {
    const fetch = await run();
    expect(fetch.mock.calls.map(([url]) => url)).toEqual([
      '/api/auth/refresh',
      '/api/systems/van-1/status',
      '/api/systems/van-1',
    ]);
    expect(fetch.mock.calls[1][1]).toMatchObject({ headers: { Authorization: 'Bearer tok' } });
  });

  it('shows the status values with their units as a region named after the system', async () => {
    await run();
    expect(glance()?.getAttribute('aria-labelledby')).toBe('cw-first-glance-title');
    expect(document.getElementById('cw-first-glance-title')?.textContent).toBe('Blue van');
    expect(text()).toContain('State of charge58 %');
    expect(text()).toContain('Voltage13.35 V');
    expect(text()).toContain('Current9.5 Ainto the pack');
    // P = V × I: 13.35 V × 9.5 A ≈ 127 W.
    expect(text()).toContain('Power127 W');
    expect(text()).not.toContain('°');
  });

  it.each([[['ja', 'de-LU']], [['nn-NO']], [['fr-CA', 'en']], [['en-GB']], [['ja']], [['pt-BR']]])(
    'formats numbers for the locale the dashboard picks from %j',
    async (languages) => {
      await run({ languages });
      const locale = resolveLocale(languages);
      const expected = new Intl.NumberFormat(locale, { minimumFractionDigits: 2 }).format(13.35);
      expect(text()).toContain(`Voltage${expected} V`);
    },
  );

  it.each(FLAG_KINDS.map((kind) => [kind]))(
    'names the active flag %s as the catalogue does',
    async (kind) => {
      await run({
        status: {
          status: 200,
          body: {
            status: status({
              latestReading: reading({ current: -2 }),
              activeAlerts: [
                {
                  id: 'a1',
                  systemId: 'van-1',
                  kind,
                  severity: 'warning',
                  startedAt: NOW - 60_000,
                  endedAt: null,
                  peakValue: null,
                  unit: '',
                  acknowledgedAt: null,
                  acknowledgedBy: null,
                  note: null,
                },
              ],
            }),
          },
        },
      });
      expect(text()).toContain(`Warning: ${flagText(kind).title}`);
    },
  );

  it('says a LiFePO4 pack is being charged below freezing before the server raises the flag', async () => {
    await run({
      status: { status: 200, body: { status: status({ latestReading: reading({ temperature: -7.5 }) }) } },
    });
    expect(text()).toContain('Critical: Charging a battery that is too cold');
  });

  it('leaves charging in the cold alone for lead-acid, as the live view does', async () => {
    await run({
      status: { status: 200, body: { status: status({ latestReading: reading({ temperature: -7.5 }) }) } },
      system: { status: 200, body: { system: { ...SUMMARY, chemistry: 'agm' } } },
    });
    expect(text()).not.toContain('too cold');
  });

  it('marks an old reading as not current', async () => {
    await run({
      status: {
        status: 200,
        body: {
          status: status({ latestReading: reading({ measuredAt: NOW - 3 * 60_000, temperature: -7 }) }),
        },
      },
    });
    expect(text()).toContain('Not current: the last reading is from');
    expect(text()).not.toContain('too cold');
  });

  it.each<[string, { status?: Answer; system?: Answer }]>([
    ['the status is refused', { status: { status: 404 } }],
    ['the description is refused', { system: { status: 403 } }],
    ['the session has ended', { status: { status: 401 } }],
    ['there is no connection', { status: 'offline' }],
    [
      'no reading has come yet',
      { status: { status: 200, body: { status: status({ latestReading: null }) } } },
    ],
  ])('paints nothing when %s', async (_case, answers) => {
    await run(answers);
    expect(glance()).toBeNull();
  });

  it('goes at the first key press, so nothing behind it is reached unseen', async () => {
    await run();
    expect(glance()).not.toBeNull();
    document.dispatchEvent(new KeyboardEvent('keydown', { key: 'Tab' }));
    expect(glance()).toBeNull();
  });
});
