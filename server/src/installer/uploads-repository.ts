import type { Sequelize } from 'sequelize';
import type { UploadListing } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { Upload } from './installer-models';

/** An upload as stored, with the file's name on disk. */
export type StoredUploadRecord = UploadListing & { storedName: string };

const toRecord = (row: Upload): StoredUploadRecord => ({
  id: row.id,
  kind: row.kind,
  fileName: row.fileName,
  contentType: row.contentType,
  bytes: row.bytes,
  uploadedAt: row.uploadedAt.getTime(),
  caption: row.caption,
  storedName: row.storedName,
});

const ATTRIBUTES = [
  'id',
  'kind',
  'fileName',
  'contentType',
  'bytes',
  'uploadedAt',
  'caption',
  'storedName',
] as const;

/** Data access for uploaded photos and logs. */
export function createUploadsRepository(sequelize: Sequelize) {
  const { Upload } = initModels(sequelize);
  return {
    async insert(
      upload: Omit<StoredUploadRecord, 'id' | 'uploadedAt'> & { systemId: string; uploadedBy: string },
    ) {
      const { id } = await Upload.create(upload, { returning: ['id'] });
      // Read back as stored (uploaded_at is the database's now()); the row was just made, so it is there.
      const row = await Upload.findByPk(id, { attributes: [...ATTRIBUTES], raw: true, rejectOnEmpty: true });
      return toRecord(row);
    },
    async list(systemId: string) {
      const rows = await Upload.findAll({
        where: { systemId },
        attributes: [...ATTRIBUTES],
        order: [['uploadedAt', 'DESC']],
        raw: true,
      });
      return rows.map(toRecord);
    },
    async find(systemId: string, id: string) {
      const row = await Upload.findOne({ where: { systemId, id }, attributes: [...ATTRIBUTES], raw: true });
      return row ? toRecord(row) : undefined;
    },
  };
}

export type UploadsRepository = ReturnType<typeof createUploadsRepository>;
