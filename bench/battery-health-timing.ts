// Battery health with a year of history: seeding the year, what the screen's API costs (stored samples and
// checkpointed figures), a year's figures recomputed from the hour rollups (the report's path), and the same
// figures computed in memory from a year of minute summaries as the baseline, plus the screen's first paint.
import { QueryTypes, type Sequelize } from 'sequelize';
import {
  capacityTrend,
  createCapacityTracker,
  createLifeCycleAccumulator,
  hoursOf,
  type CapacitySample,
  type MinuteSummary,
} from '@cellwarden/shared';
import { DEMO_YEAR_SEED, seedDemoBatteryYear } from '../db/seeders/demo-battery-year';
import { DEMO_DEVICES, DEMO_PASSWORD, DEMO_USERS } from '../db/seeders/demo-scenario';
import { launchChromium } from '../test/browser/launch-chromium';
import { yearOfUse } from '../simulator/src/year-of-use';
import type { Row } from './bench-table';

const DAY = 86_400_000;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

async function timed<T>(work: () => Promise<T> | T): Promise<{ ms: number; value: T }> {
  const started = performance.now();
  const value = await work();
  return { ms: performance.now() - started, value };
}

/** The baseline: a year of minutes already in memory through the tracker, the hour roll-up and the accumulator. */
function figuresInMemory(minutes: readonly MinuteSummary[], timeZone: string) {
  const tracker = createCapacityTracker({
    chemistry: 'lifepo4',
    nominalVoltage: 12,
    ratedCapacityAh: 200,
    usableCapacityAh: 190,
  });
  const samples: CapacitySample[] = [];
  for (const minute of minutes) {
    const sample = tracker.push(minute);
    if (sample) samples.push(sample);
  }
  const accumulator = createLifeCycleAccumulator(190);
  for (const hour of hoursOf(minutes)) accumulator.push(hour);
  return { trend: capacityTrend(samples, 190, timeZone), figures: accumulator.figures() };
}

/** Median time until the health screen's capacity chart is on screen, and the history screen's for comparison. */
async function firstPaint(baseUrl: string, systemId: string, runs: number) {
  const chromium = await launchChromium();
  try {
    const visit = async (path: string, selector: string) => {
      const context = await chromium.browser.newContext({ viewport: { width: 1280, height: 900 } });
      const page = await context.newPage();
      const signIn = await page.request.post(`${baseUrl}/api/auth/sign-in`, {
        data: { email: DEMO_USERS[0].email, password: DEMO_PASSWORD },
      });
      if (!signIn.ok()) throw new Error(`sign-in answered ${signIn.status()}`);
      const started = performance.now();
      await page.goto(`${baseUrl}${path}`);
      await page.locator(selector).first().waitFor({ state: 'visible', timeout: 30_000 });
      const ms = performance.now() - started;
      await context.close();
      return ms;
    };
    const health: number[] = [];
    const history: number[] = [];
    for (let i = 0; i < runs; i++) {
      health.push(
        await visit(`/systems/${systemId}/battery-health`, 'canvas[aria-label^="Estimated usable"]'),
      );
      history.push(await visit(`/systems/${systemId}/history`, '.chart canvas'));
    }
    return { healthMs: median(health), historyMs: median(history) };
  } finally {
    await chromium.close();
  }
}

/** Seeds the demo van's year and measures; the van must exist (demo scenario) with no health figures yet. */
export async function timeBatteryHealth(options: {
  sequelize: Sequelize;
  baseUrl: string;
  token: string;
  repeats: number;
  paint: boolean;
}): Promise<Row[]> {
  const { sequelize, baseUrl, token } = options;
  const [{ systemId }] = await sequelize.query<{ systemId: string }>(
    'SELECT system_id AS "systemId" FROM devices WHERE id = :id',
    { replacements: { id: DEMO_DEVICES[0].id }, type: QueryTypes.SELECT },
  );
  const end = Date.now();
  const seeding = await timed(() => seedDemoBatteryYear(sequelize, { end }));
  const generation = await timed(() => {
    const minutes: MinuteSummary[] = [];
    for (const { minute } of yearOfUse({ seed: DEMO_YEAR_SEED, start: end - 365 * DAY, days: 365 }))
      minutes.push(minute);
    return minutes;
  });
  const baseline: number[] = [];
  for (let i = 0; i < Math.max(1, Math.floor(options.repeats / 5)); i++)
    baseline.push((await timed(() => figuresInMemory(generation.value, 'Europe/Helsinki'))).ms);
  const get = async (path: string) => {
    const response = await fetch(`${baseUrl}${path}`, { headers: { authorization: `Bearer ${token}` } });
    if (!response.ok) throw new Error(`${path} answered ${response.status}`);
    return response.text();
  };
  const screen: number[] = [];
  const report: number[] = [];
  const from = new Date(end - 366 * DAY).toISOString();
  const to = new Date(end).toISOString();
  for (let i = 0; i < options.repeats; i++) {
    screen.push((await timed(() => get(`/api/systems/${systemId}/battery-health`))).ms);
    report.push(
      (await timed(() => get(`/api/systems/${systemId}/battery-health/report.csv?from=${from}&to=${to}`))).ms,
    );
  }
  const memory = median(baseline);
  const rows: Row[] = [
    {
      what: 'demo battery year seeded (365 days → tracker, 8,760 hour rollups)',
      value: `${(seeding.ms / 1000).toFixed(1)} s`,
      against: `generating its minutes ${(generation.ms / 1000).toFixed(1)} s`,
      ratio: (seeding.ms / generation.ms).toFixed(2),
    },
    {
      what: 'battery health API, a year (stored samples + checkpoint)',
      value: `${median(screen).toFixed(1)} ms`,
      against: `year of minutes in memory ${memory.toFixed(0)} ms`,
      ratio: (median(screen) / memory).toFixed(3),
    },
    {
      what: '  … a year recomputed from hour rollups (report.csv)',
      value: `${median(report).toFixed(1)} ms`,
      against: `year of minutes in memory ${memory.toFixed(0)} ms`,
      ratio: (median(report) / memory).toFixed(3),
    },
  ];
  if (options.paint) {
    const paint = await firstPaint(baseUrl, systemId, 3);
    rows.push({
      what: 'battery health screen, capacity chart on screen',
      value: `${paint.healthMs.toFixed(0)} ms`,
      against: `history screen chart ${paint.historyMs.toFixed(0)} ms`,
      ratio: (paint.healthMs / paint.historyMs).toFixed(2),
    });
  }
  return rows;
}
