import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { createErrorHandler } from '../errors/error-handler';
import { createMemoryLogger } from '../logger';
import { acceptUpload } from './upload-policy';
import { createUploadStorage } from './upload-storage';

// A stand-in for the real route: middleware, policy, storage, and the one error handler.
function uploadApp(root: string, maxBytes?: number) {
  const storage = createUploadStorage({ root, maxBytes });
  const app = express();
  app.post('/systems/:systemId/uploads', storage.middleware(), async (req, res) => {
    const file = req.file!;
    const upload = acceptUpload({
      kind: req.body.kind,
      caption: req.body.caption,
      fileName: file.originalname,
      declaredType: file.mimetype,
      content: file.buffer,
    });
    const stored = await storage.save(String(req.params.systemId), upload);
    res.status(201).json({ ...stored, fileName: upload.displayName, caption: upload.caption });
  });
  app.use(createErrorHandler(createMemoryLogger()));
  return app;
}

const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(60, 7)]);

describe('uploading through the multipart middleware', () => {
  let root: string;
  beforeEach(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'cw-upload-app-'));
  });
  afterEach(() => rm(root, { recursive: true, force: true }));

  it('stores a photo under a new name and keeps a safe display name', async () => {
    const response = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .field('kind', 'photo')
      .field('caption', 'Fuse at the battery')
      .attach('file', JPEG, { filename: '../../fuse.jpg', contentType: 'image/jpeg' })
      .expect(201);
    expect(response.body.fileName).toBe('fuse.jpg');
    expect(response.body.storedName).toMatch(/^[0-9a-f-]{36}\.jpg$/);
    expect((await readFile(path.join(root, 'sys-1', response.body.storedName))).equals(JPEG)).toBe(true);
  });

  it('stores a CSV log whose cells start with = + - @ exactly as sent', async () => {
    const csv = Buffer.from('=cmd|"/c calc"!A1,+1,-2,@SUM(A1)\r\n', 'utf8');
    const response = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .field('kind', 'log')
      .attach('file', csv, { filename: 'log.csv', contentType: 'text/csv' })
      .expect(201);
    expect((await readFile(path.join(root, 'sys-1', response.body.storedName))).equals(csv)).toBe(true);
  });

  it('answers 413 with field file for a file over the limit', async () => {
    const response = await request(uploadApp(root, 1024))
      .post('/systems/sys-1/uploads')
      .field('kind', 'photo')
      .attach('file', Buffer.concat([JPEG, Buffer.alloc(2048)]), {
        filename: 'big.jpg',
        contentType: 'image/jpeg',
      })
      .expect(413);
    expect(response.body.error).toMatchObject({ code: 'file_too_large', field: 'file' });
  });

  it('answers 413 for a file one byte over the default 10 MB', async () => {
    const big = Buffer.concat([JPEG, Buffer.alloc(10 * 1024 * 1024 + 1 - JPEG.length)]);
    const response = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .attach('file', big, { filename: 'big.jpg', contentType: 'image/jpeg' })
      .expect(413);
    expect(response.body.error.field).toBe('file');
  });

  it('refuses a file in another field, naming file', async () => {
    const response = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .attach('photo', JPEG, { filename: 'a.jpg', contentType: 'image/jpeg' })
      .expect(400);
    expect(response.body.error.field).toBe('file');
  });

  it('refuses a request with no file, and an unexpected text field', async () => {
    const none = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .field('kind', 'photo')
      .expect(400);
    expect(none.body.error.field).toBe('file');
    const extra = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .field('owner', 'x')
      .attach('file', JPEG, { filename: 'a.jpg', contentType: 'image/jpeg' })
      .expect(400);
    expect(extra.body.error.field).toBe('owner');
  });

  it('refuses an executable renamed to .jpg', async () => {
    const exe = Buffer.from([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00]);
    const response = await request(uploadApp(root))
      .post('/systems/sys-1/uploads')
      .field('kind', 'photo')
      .attach('file', exe, { filename: 'photo.jpg', contentType: 'image/jpeg' })
      .expect(400);
    expect(response.body.error.field).toBe('file');
  });
});
