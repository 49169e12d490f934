import { constants, type ReadStream } from 'node:fs';
import { mkdir, open, realpath, unlink } from 'node:fs/promises';
import path from 'node:path';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError, invalidInput, notFound } from '../errors/app-error';
import { toUploadError } from './multipart-errors';
import { UPLOAD_LIMIT_BYTES, newStoredName, type AcceptedUpload } from './upload-policy';

/** Where uploads live and how large one may be. */
export interface UploadStorageOptions {
  /** Folder holding `<systemId>/<storedName>`; created when missing. */
  root: string;
  /** Largest file, bytes (default 10 MB). */
  maxBytes?: number;
}

/** Where a saved upload went. */
export interface StoredUpload {
  storedName: string;
  bytes: number;
}

/** Files of systems on disk, inside one root folder and nowhere else. */
export interface UploadStorage {
  /** Multer in memory: one file in field `file`, text fields `caption` and `kind`; sets req.file. */
  middleware(): RequestHandler;
  save(systemId: string, upload: Pick<AcceptedUpload, 'content' | 'contentType'>): Promise<StoredUpload>;
  open(systemId: string, storedName: string): Promise<ReadStream>;
  remove(systemId: string, storedName: string): Promise<void>;
}

const SYSTEM_ID = /^[A-Za-z0-9][A-Za-z0-9_-]{0,63}$/;
const STORED_NAME = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\.(jpg|png|txt|csv)$/;
const TEXT_FIELDS = new Set(['caption', 'kind']);

/** Upload storage under `root`; every path is checked to stay inside it, symlinks included. */
export function createUploadStorage({
  root,
  maxBytes = UPLOAD_LIMIT_BYTES,
}: UploadStorageOptions): UploadStorage {
  const base = path.resolve(root);
  return {
    middleware: () => uploadMiddleware(maxBytes),
    async save(systemId, upload) {
      const folder = await systemFolder(base, systemId, true);
      const storedName = newStoredName(upload.contentType);
      // 'wx' never follows or replaces an existing entry, so a planted symlink cannot be written through.
      const handle = await open(path.join(folder, storedName), 'wx', 0o640);
      try {
        await handle.writeFile(upload.content);
      } finally {
        await handle.close();
      }
      return { storedName, bytes: upload.content.length };
    },
    async open(systemId, storedName) {
      const file = await storedFile(base, systemId, storedName);
      const handle = await open(file, constants.O_RDONLY | constants.O_NOFOLLOW).catch(fileError);
      return handle.createReadStream();
    },
    async remove(systemId, storedName) {
      await unlink(await storedFile(base, systemId, storedName)).catch(fileError);
    },
  };
}

function uploadMiddleware(maxBytes: number): RequestHandler {
  const single = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 2, parts: 3, fieldSize: 4096, fieldNameSize: 32 },
  }).single('file');
  return (req, res, next) => {
    single(req, res, (error: unknown) => {
      if (error) return next(toUploadError(error, maxBytes));
      const unexpected = Object.keys(req.body ?? {}).find((name) => !TEXT_FIELDS.has(name));
      if (unexpected)
        return next(invalidInput(unexpected, `unexpected field ${unexpected}; send file, kind and caption`));
      if (!req.file) return next(invalidInput('file', 'choose a file to upload, in the field "file"'));
      next();
    });
  };
}

async function systemFolder(base: string, systemId: string, create: boolean): Promise<string> {
  if (!SYSTEM_ID.test(systemId)) throw unsafePath('systemId', systemId);
  const folder = inside(base, path.resolve(base, systemId), 'systemId', systemId);
  if (create) await mkdir(folder, { recursive: true, mode: 0o750 });
  // realpath resolves symlinks: a system folder linked to somewhere else is refused.
  const [realBase, realFolder] = await Promise.all([realpath(base), realpath(folder).catch(fileError)]);
  inside(realBase, realFolder, 'systemId', systemId);
  return realFolder;
}

async function storedFile(base: string, systemId: string, storedName: string): Promise<string> {
  if (!STORED_NAME.test(storedName)) throw unsafePath('storedName', storedName);
  const folder = await systemFolder(base, systemId, false);
  return inside(folder, path.resolve(folder, storedName), 'storedName', storedName);
}

function inside(base: string, candidate: string, field: string, value: string): string {
  const relative = path.relative(base, candidate);
  if (!relative || relative.startsWith('..') || path.isAbsolute(relative)) throw unsafePath(field, value);
  return candidate;
}

function unsafePath(field: string, value: string): AppError {
  return new AppError(
    'unsafe_path',
    400,
    `${field} is not a valid upload name; got ${JSON.stringify(value)}`,
    field,
  );
}

function fileError(error: NodeJS.ErrnoException): never {
  if (error.code === 'ENOENT') throw notFound('Upload');
  // ELOOP: O_NOFOLLOW met a symlink where the file should be.
  if (error.code === 'ELOOP')
    throw new AppError('unsafe_path', 400, 'the upload is not a regular file', 'storedName');
  throw error;
}
