import { QueryTypes, type Sequelize } from 'sequelize';
import type { UploadListing } from '@cellwarden/shared';

/** An upload as stored, with the file's name on disk. */
export type StoredUploadRecord = UploadListing & { storedName: string };

const SELECT_UPLOAD = `SELECT id, kind, file_name AS "fileName", content_type AS "contentType", bytes,
  (extract(epoch FROM uploaded_at) * 1000)::float8 AS "uploadedAt", caption, stored_name AS "storedName" FROM uploads`;

/** Data access for uploaded photos and logs. */
export function createUploadsRepository(sequelize: Sequelize) {
  const select = (where: string, replacements: Record<string, unknown>) =>
    sequelize.query<StoredUploadRecord>(`${SELECT_UPLOAD} ${where}`, {
      replacements,
      type: QueryTypes.SELECT,
    });
  return {
    async insert(
      upload: Omit<StoredUploadRecord, 'id' | 'uploadedAt'> & { systemId: string; uploadedBy: string },
    ) {
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO uploads (system_id, uploaded_by, kind, file_name, stored_name, content_type, bytes, caption)
         VALUES (:systemId, :uploadedBy, :kind, :fileName, :storedName, :contentType, :bytes, :caption) RETURNING id`,
        { replacements: upload, type: QueryTypes.SELECT },
      );
      return (await select('WHERE id = :id', { id: row.id }))[0];
    },
    list: (systemId: string) => select('WHERE system_id = :systemId ORDER BY uploaded_at DESC', { systemId }),
    async find(systemId: string, id: string) {
      return (await select('WHERE system_id = :systemId AND id = :id', { systemId, id }))[0];
    },
  };
}

export type UploadsRepository = ReturnType<typeof createUploadsRepository>;
