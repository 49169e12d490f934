import { randomUUID } from 'node:crypto';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { seedDemoScenario } from '../../db/seeders/demo-scenario';
import demo from '../../db/seeders/demo-sign-ins.json';
import { connectDatabase } from '../../server/src/database/connect-database';
import { extractPdfText } from '../../server/src/records/pdf-text-reader';
import { blackPng, pngSize, pngWithJunkData } from '../support/crafted-images';
import { signInAs } from '../support/http-session';
import { createProcessServer, freePort, healthStatus, type ProcessServer } from '../support/process-server';
import { createTestDatabase } from '../support/test-database';

jest.setTimeout(120000);

// Photos that cannot hurt: the server runs as its own process here, so a render that used to end the
// process shows as exactly that (a reset connection and no health answer), not as a crashed test runner.

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let seeding: Sequelize;
let server: ProcessServer;
let owner: string;
let vanId: string;
const uploadDir = mkdtempSync(join(tmpdir(), 'cw-hostile-uploads-'));

beforeAll(async () => {
  database = await createTestDatabase();
  seeding = connectDatabase(database.url);
  await seedDemoScenario(seeding);
  server = createProcessServer({
    databaseUrl: database.url,
    httpPort: await freePort(),
    mqttPort: await freePort(),
    env: { UPLOAD_DIR: uploadDir },
  });
  server.start();
  await server.ready();
  owner = (await signInAs(server.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const systems = await request(server.baseUrl).get('/api/systems').set('Authorization', `Bearer ${owner}`);
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
});
afterAll(async () => {
  await server?.stop();
  await seeding?.close();
  await database?.drop();
  rmSync(uploadDir, { recursive: true, force: true });
});

const uploadPhoto = (content: Buffer, caption: string) =>
  request(server.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set('Authorization', `Bearer ${owner}`)
    .field('kind', 'photo')
    .field('caption', caption)
    .attach('file', content, { filename: `${caption}.png`, contentType: 'image/png' });
const refusal = (r: request.Response) => ({ status: r.status, field: r.body?.error?.field });
const renderRecord = () =>
  request(server.baseUrl)
    .get(`/api/systems/${vanId}/commissioning-record.pdf`)
    .set('Authorization', `Bearer ${owner}`)
    .buffer(true)
    .parse((response, done) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => done(null, Buffer.concat(chunks)));
    })
    .catch((error: Error) => ({ status: 0, body: Buffer.from(error.message) }));

it('refuses a PNG whose signature is right but whose image data is junk, naming the file', async () => {
  const response = await uploadPhoto(pngWithJunkData(), 'junk behind a signature');
  console.log(`hostile-uploads: junk PNG answered ${response.status} ${response.body?.error?.code}`);
  expect(refusal(response)).toEqual({ status: 400, field: 'file' });
});

it('refuses decompression bombs with a 4xx naming the file, before decoding them', async () => {
  // 64 megapixels in about 62 kB, and a 20,000 px side in a few hundred bytes.
  const bombs = [blackPng(8000, 8000), blackPng(20000, 10)];
  const answers = [];
  for (const [i, bomb] of bombs.entries()) answers.push(refusal(await uploadPhoto(bomb, `bomb ${i}`)));
  console.log(
    `hostile-uploads: bombs of ${bombs.map((b) => `${Math.round(b.length / 1024)} kB`).join(', ')} answered ${JSON.stringify(answers)}`,
  );
  expect(answers).toEqual([
    { status: 422, field: 'file' },
    { status: 422, field: 'file' },
  ]);
});

it('stores a large photo as a smaller re-encoded copy without its metadata', async () => {
  const original = blackPng(6000, 4000, 6, 'taken at 52.0907 N 5.1214 E');
  const response = await uploadPhoto(original, 'big but fine');
  expect(response.status).toBe(201);
  const stored = await request(server.baseUrl)
    .get(`/api/systems/${vanId}/uploads/${response.body.upload.id}`)
    .set('Authorization', `Bearer ${owner}`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
  const body = stored.body as Buffer;
  console.log(
    `hostile-uploads: ${Math.round(original.length / 1024)} kB 6000×4000 upload stored as ${JSON.stringify(pngSize(body))}, ${body.length} bytes`,
  );
  expect(body.subarray(1, 4).toString('latin1')).toBe('PNG');
  expect(pngSize(body)).toEqual({ width: 2048, height: 1365 });
  expect(body.includes('52.0907')).toBe(false);
});

it('renders the record though a photo stored before these checks is junk, and stays up', async () => {
  // As an older server stored it: the file on disk and its row, never decoded.
  const storedName = `${randomUUID()}.png`;
  mkdirSync(join(uploadDir, vanId), { recursive: true });
  writeFileSync(join(uploadDir, vanId, storedName), pngWithJunkData());
  const [{ id: ownerId }] = await seeding.query<{ id: string }>('SELECT id FROM users WHERE email = :email', {
    replacements: { email: demo.users[0].email },
    type: QueryTypes.SELECT,
  });
  await seeding.query(
    `INSERT INTO uploads (system_id, uploaded_by, kind, file_name, stored_name, content_type, bytes, caption)
     VALUES (:vanId, :ownerId, 'photo', 'old.png', :storedName, 'image/png', 900, 'Stored long ago')`,
    { replacements: { vanId, ownerId, storedName } },
  );

  const record = await renderRecord();
  const health = await healthStatus(server.baseUrl);
  console.log(`hostile-uploads: record with a junk stored photo answered ${record.status}; health ${health}`);
  expect([record.status, health]).toEqual([200, 200]);
  const text = extractPdfText(record.body as Buffer);
  expect(text).toContain('Stored long ago (the image could not be read and is left out)');
  expect(text).toContain('big but fine');
});
