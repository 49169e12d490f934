import fc from 'fast-check';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { blackPng } from '../support/crafted-images';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

jest.setTimeout(120000);

// The file-taking routes: CSV import, the uploads, and what the CSV export makes of stored values.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let owner: string;
let vanId: string;
const uploadDir = mkdtempSync(join(tmpdir(), 'cw-bad-files-'));
const HEADER = 'measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w';

beforeAll(async () => {
  node = await startTestServer({ env: { UPLOAD_DIR: uploadDir } });
  owner = (await signInAs(node.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const systems = await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${owner}`);
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
});
afterAll(async () => {
  await node.stop();
  rmSync(uploadDir, { recursive: true, force: true });
});

const auth = () => ({ Authorization: `Bearer ${owner}` });
const importCsv = (text: string, type = 'text/csv') =>
  request(node.baseUrl)
    .post(`/api/systems/${vanId}/readings/import`)
    .set(auth())
    .set('Content-Type', type)
    .send(text);

// Cells that break naive CSV handling: formula starts (OWASP "CSV Injection"), quotes, separators, controls.
const nastyCell = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.constantFrom(
    '=1+1',
    '+SUM(A1)',
    '-2+3',
    '@cmd',
    '\t=1',
    '"',
    '""',
    ',',
    '\r\n',
    '\u0000',
    'NaN',
    '1e5',
    '0x10',
    '١٢',
  ),
  fc.double().map(String),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
);
const csvText = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 400 }),
  fc
    .tuple(
      fc.array(fc.array(nastyCell, { minLength: 1, maxLength: 8 }), { maxLength: 6 }),
      fc.constantFrom('\n', '\r\n', '\r'),
    )
    .map(([rows, newline]) => [HEADER, ...rows.map((r) => r.join(','))].join(newline)),
);

/** Whether an answer is a clean refusal: 4xx with a stable error code. */
const refusedCleanly = (r: request.Response) =>
  r.status >= 400 && r.status < 500 && typeof r.body.error?.code === 'string';

it('answers garbage CSV imports with a 4xx and an error code, or imports them whole', async () => {
  const statuses: Record<number, number> = {};
  await fc.assert(
    fc.asyncProperty(csvText, async (text) => {
      const response = await importCsv(text);
      statuses[response.status] = (statuses[response.status] ?? 0) + 1;
      const accepted = response.status === 200 && Number.isInteger(response.body.import?.rows);
      expect({ status: response.status, ok: accepted || refusedCleanly(response) }).toEqual({
        status: response.status,
        ok: true,
      });
    }),
    { numRuns: 150 },
  );
  const others = [
    await importCsv('a,b', 'application/octet-stream'),
    await importCsv('x'.repeat(17 * 1024 * 1024)),
  ];
  others.forEach((r) => (statuses[r.status] = (statuses[r.status] ?? 0) + 1));
  console.log(`bad-input-files: CSV import answered ${JSON.stringify(statuses)}`);
  expect(others.map(refusedCleanly)).toEqual([true, true]);
});

it('exports no cell a spreadsheet would run as a formula', async () => {
  const now = Date.now();
  const rows = [0, 1, 2].map(
    (i) => `${new Date(now - 3600_000 + i * 1000).toISOString()},12.9,-4.25,-3.5,55,-54.8`,
  );
  expect((await importCsv([HEADER, ...rows].join('\n'))).status).toBe(200);
  const formula = await importCsv(
    [HEADER, `${new Date(now - 1800_000).toISOString()},=1+1,@SUM(A1),+3,,`].join('\n'),
  );
  const csv = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/readings.csv`)
    .query({ from: new Date(now - 7200_000).toISOString(), to: new Date(now).toISOString() })
    .set(auth());
  const cells = csv.text
    .split(/\r?\n/)
    .filter(Boolean)
    .flatMap((line) => line.split(','));
  // OWASP "CSV Injection": = + - @ TAB CR start a formula; a plain signed number is inert.
  const risky = cells.filter((c) => /^[=+\-@\t\r]/.test(c) && !/^-\d+(\.\d+)?$/.test(c));
  console.log(
    `bad-input-files: CSV export ${cells.length} cells, ${risky.length} formula-like; formula import answered ${formula.status}`,
  );
  expect([csv.status, csv.headers['content-type'], csv.headers['x-content-type-options']]).toEqual([
    200,
    'text/csv; charset=utf-8',
    'nosniff',
  ]);
  expect(refusedCleanly(formula)).toBe(true);
  expect(cells.length).toBeGreaterThanOrEqual(4 * 6);
  expect(risky).toEqual([]);
});

const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
const uploadCase = fc.record({
  content: fc.oneof(
    fc.uint8Array({ maxLength: 300 }).map((b) => Buffer.from(b)),
    fc.constant(PNG),
    fc.constant(Buffer.from('<svg onload=alert(1)>')),
  ),
  fileName: fc.oneof(
    fc.string({ unit: 'binary', minLength: 1, maxLength: 60 }),
    fc.constantFrom('../../etc/passwd', 'a\r\nb.png', 'x.png.exe', '.htaccess', 'photo.png'),
  ),
  contentType: fc.constantFrom(
    'image/png',
    'image/jpeg',
    'text/plain',
    'text/html',
    'image/svg+xml',
    'application/octet-stream',
  ),
  kind: fc.option(fc.oneof(fc.constantFrom('photo', 'log'), fc.string({ maxLength: 10 })), {
    nil: undefined,
  }),
  caption: fc.option(fc.oneof(fc.string({ unit: 'binary', maxLength: 60 }), fc.constant('x'.repeat(600))), {
    nil: undefined,
  }),
});

it('answers garbage uploads with a 4xx and an error code, or stores them under a name of its own', async () => {
  const statuses: Record<number, number> = {};
  await fc.assert(
    fc.asyncProperty(uploadCase, async (c) => {
      const call = request(node.baseUrl).post(`/api/systems/${vanId}/uploads`).set(auth());
      if (c.kind !== undefined) call.field('kind', c.kind);
      if (c.caption !== undefined) call.field('caption', c.caption);
      const response = await call.attach('file', c.content, {
        filename: c.fileName,
        contentType: c.contentType,
      });
      statuses[response.status] = (statuses[response.status] ?? 0) + 1;
      const stored = response.status === 201 && !/[/\\\r\n]/.test(response.body.upload?.fileName ?? '/');
      expect({ status: response.status, ok: stored || refusedCleanly(response) }).toEqual({
        status: response.status,
        ok: true,
      });
    }),
    { numRuns: 120 },
  );
  const noFile = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set(auth())
    .field('kind', 'log');
  const notMultipart = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set(auth())
    .send({ file: 'x' });
  const tooBig = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set(auth())
    .field('kind', 'log')
    .attach('file', Buffer.alloc(11 * 1024 * 1024, 0x61), { filename: 'big.txt', contentType: 'text/plain' });
  const traversal = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set(auth())
    .field('kind', 'photo')
    .attach('file', blackPng(8, 8), { filename: '../../../etc/cron.d/x.png', contentType: 'image/png' });
  statuses[traversal.status] = (statuses[traversal.status] ?? 0) + 1;
  expect([traversal.status, /[/\\]/.test(traversal.body.upload?.fileName ?? '/')]).toEqual([201, false]);
  [noFile, notMultipart, tooBig].forEach((r) => (statuses[r.status] = (statuses[r.status] ?? 0) + 1));
  console.log(`bad-input-files: uploads answered ${JSON.stringify(statuses)}`);
  expect([noFile, notMultipart, tooBig].map(refusedCleanly)).toEqual([true, true, true]);
  expect((await request(node.baseUrl).get('/api/health')).status).toBe(200);
});
