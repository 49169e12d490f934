import { mkdtemp, mkdir, readFile, rm, symlink, writeFile, readdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { AppError } from '../errors/app-error';
import { createUploadStorage, type UploadStorage } from './upload-storage';

const CSV = Buffer.from('=1+2,+3,-4,@SUM(A1)\n13.2,-4.1,25,0\n', 'utf8');
const UUID_NAME = '0f8fad5b-d9cb-469f-a165-70867728950e.csv';

describe('createUploadStorage', () => {
  let work: string;
  let root: string;
  let outside: string;
  let storage: UploadStorage;

  beforeEach(async () => {
    work = await mkdtemp(path.join(tmpdir(), 'cw-uploads-'));
    root = path.join(work, 'root');
    outside = path.join(work, 'outside');
    await mkdir(root);
    await mkdir(outside);
    await writeFile(path.join(outside, UUID_NAME), 'secret');
    storage = createUploadStorage({ root });
  });
  afterEach(() => rm(work, { recursive: true, force: true }));

  const refusal = async (promise: Promise<unknown>): Promise<AppError> => {
    const error = await promise.then(
      () => undefined,
      (caught: unknown) => caught,
    );
    expect(error).toBeInstanceOf(AppError);
    return error as AppError;
  };

  it('stores a CSV log byte for byte under <root>/<systemId>/<uuid>.csv, formulas and all', async () => {
    const { storedName, bytes } = await storage.save('sys-1', { content: CSV, contentType: 'text/csv' });
    expect(bytes).toBe(CSV.length);
    expect(storedName).toMatch(/^[0-9a-f-]{36}\.csv$/);
    expect((await readFile(path.join(root, 'sys-1', storedName))).equals(CSV)).toBe(true);
    expect(await text(await storage.open('sys-1', storedName))).toBe(CSV.toString('utf8'));
  });

  it('removes a stored file, then answers not found', async () => {
    const { storedName } = await storage.save('sys-1', { content: CSV, contentType: 'text/csv' });
    await storage.remove('sys-1', storedName);
    expect(await readdir(path.join(root, 'sys-1'))).toEqual([]);
    expect((await refusal(storage.open('sys-1', storedName))).code).toBe('not_found');
  });

  it.each([
    ['..', UUID_NAME],
    ['../outside', UUID_NAME],
    ['/etc', UUID_NAME],
    ['sys-1\u0000', UUID_NAME],
    ['sys-1/../../outside', UUID_NAME],
  ])('refuses the system folder %j', async (systemId, storedName) => {
    const error = await refusal(storage.open(systemId, storedName));
    expect(error.code).toBe('unsafe_path');
    expect(error.field).toBe('systemId');
    expect((await refusal(storage.save(systemId, { content: CSV, contentType: 'text/csv' }))).code).toBe(
      'unsafe_path',
    );
  });

  it.each([
    `../../outside/${UUID_NAME}`,
    `/tmp/outside/${UUID_NAME}`,
    '/etc/passwd',
    `${UUID_NAME}\u0000.jpg`,
    'notes.csv',
  ])('refuses the stored name %j', async (storedName) => {
    await mkdir(path.join(root, 'sys-1'));
    const error = await refusal(storage.open('sys-1', storedName));
    expect(error.field).toBe('storedName');
    expect((await refusal(storage.remove('sys-1', storedName))).field).toBe('storedName');
  });

  it('refuses a system folder that is a symlink out of the root', async () => {
    await symlink(outside, path.join(root, 'sys-2'));
    expect((await refusal(storage.open('sys-2', UUID_NAME))).code).toBe('unsafe_path');
    expect((await refusal(storage.save('sys-2', { content: CSV, contentType: 'text/csv' }))).code).toBe(
      'unsafe_path',
    );
    expect(await readdir(outside)).toEqual([UUID_NAME]);
  });

  it('refuses a stored file that is a symlink out of the root', async () => {
    await mkdir(path.join(root, 'sys-3'));
    await symlink(path.join(outside, UUID_NAME), path.join(root, 'sys-3', UUID_NAME));
    expect((await refusal(storage.open('sys-3', UUID_NAME))).code).toBe('unsafe_path');
  });

  it('answers not found for a system with no uploads yet', async () => {
    expect((await refusal(storage.open('sys-9', UUID_NAME))).code).toBe('not_found');
  });
});
