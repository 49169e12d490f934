import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

jest.setTimeout(120000);

// Inputs that are well-formed enough to pass a first glance but name times outside any calendar the
// database has, or null where an entry belongs: each must be refused with a 4xx naming the field.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let owner: string;
let vanId: string;

beforeAll(async () => {
  node = await startTestServer();
  owner = (await signInAs(node.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const systems = await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${owner}`);
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
});
afterAll(() => node.stop());

const get = (path: string, query: Record<string, string>) =>
  request(node.baseUrl).get(path).query(query).set('Authorization', `Bearer ${owner}`);
const refusal = (r: request.Response) => ({ status: r.status, field: r.body?.error?.field });
// Where both ends are outside the calendar, naming either one is right.
const TIME_FIELD = expect.stringMatching(/^(from|to)$/);

const FAR_TIMES: Record<string, string>[] = [
  // Year 0: valid ISO 8601 and a valid JavaScript date, but PostgreSQL has no year 0.
  { from: '0000-01-01T00:00:00Z', to: '0000-02-01T00:00:00Z' },
  // The far end of JavaScript's calendar (±8.64e15 ms), one day wide so the range limit does not catch it.
  { from: '-271821-04-20T00:00:00Z', to: '-271821-04-21T00:00:00Z' },
  { from: '+275760-09-12T00:00:00Z', to: '+275760-09-13T00:00:00Z' },
  { from: '-99999999999999' },
];

it('refuses history ranges outside the calendar with a 400 naming the field', async () => {
  const answers = [];
  for (const query of FAR_TIMES) answers.push(refusal(await get(`/api/systems/${vanId}/readings`, query)));
  console.log(`odd-inputs: history answered ${JSON.stringify(answers)}`);
  expect(answers).toEqual(FAR_TIMES.map(() => ({ status: 400, field: TIME_FIELD })));
});

it('refuses a year-0 CSV export before sending any header, and stays up', async () => {
  const answers = [];
  for (const query of FAR_TIMES.slice(0, 3)) {
    const response = await get(`/api/systems/${vanId}/readings.csv`, query);
    answers.push({ ...refusal(response), type: response.headers['content-type'] });
  }
  console.log(`odd-inputs: CSV export answered ${JSON.stringify(answers)}`);
  expect(answers).toEqual(
    FAR_TIMES.slice(0, 3).map(() => ({
      status: 400,
      field: TIME_FIELD,
      type: 'application/json; charset=utf-8',
    })),
  );
  expect((await request(node.baseUrl).get('/api/health')).status).toBe(200);
});

it('refuses alert queries outside the calendar with a 400 naming the field', async () => {
  const response = await get(`/api/systems/${vanId}/alerts`, FAR_TIMES[0]);
  expect(refusal(response)).toEqual({ status: 400, field: TIME_FIELD });
});

it('refuses an energy budget with null entries with a 400 naming the entry', async () => {
  const system = {
    nominalVoltage: 12,
    inverterEfficiency: 0.9,
    inverterRatedW: 0,
    bmsContinuousA: 100,
    usableFraction: 0.9,
    daysOfAutonomy: 1,
  };
  const cases = [
    { budget: { loads: [null], sources: [], system }, field: 'loads[0]' },
    { budget: { loads: [], sources: [null], system }, field: 'sources[0]' },
    { budget: { loads: null, sources: [], system }, field: 'budget.loads' },
  ];
  const answers = [];
  for (const { budget } of cases) {
    const response = await request(node.baseUrl)
      .post(`/api/systems/${vanId}/energy-budgets`)
      .set('Authorization', `Bearer ${owner}`)
      .send({ name: 'odd', budget });
    answers.push(refusal(response));
  }
  console.log(`odd-inputs: energy budgets answered ${JSON.stringify(answers)}`);
  expect(answers).toEqual(cases.map(({ field }) => ({ status: 400, field })));
});
