import type { PublicUser, UploadListing } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { invalidInput, notFound } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { CommissioningRecordPhoto } from '../records/commissioning-record-input';
import { decodePhoto, photoForRecord, type DecodedPhoto } from '../uploads/photo-decoder';
import { acceptUpload } from '../uploads/upload-policy';
import type { UploadStorage } from '../uploads/upload-storage';
import type { UploadsRepository } from './uploads-repository';
import { isUuid } from '../database/sql-values';

const listing = ({ storedName: _stored, ...upload }: UploadListing & { storedName: string }): UploadListing =>
  upload;

/** Photos and logs of an installation: checked by the upload policy, stored on disk, listed per system. */
export function createUploadsService(deps: {
  repository: UploadsRepository;
  storage: UploadStorage;
  systems: SystemsService;
  audit: AuditService;
}) {
  async function readStored(systemId: string, storedName: string): Promise<Buffer> {
    const chunks: Buffer[] = [];
    for await (const chunk of await deps.storage.open(systemId, storedName)) chunks.push(chunk as Buffer);
    return Buffer.concat(chunks);
  }

  return {
    async add(
      user: PublicUser,
      systemId: string,
      file: { originalname: string; mimetype: string; buffer: Buffer } | undefined,
      fields: { kind?: unknown; caption?: unknown },
    ): Promise<UploadListing> {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      if (!file) throw invalidInput('file', 'attach a file in the field "file"');
      const accepted = acceptUpload({
        kind: fields.kind,
        caption: fields.caption,
        fileName: file.originalname,
        declaredType: file.mimetype,
        content: file.buffer,
      });
      // A photo is stored only as the re-encoded copy of an image that decoded whole within the limits.
      if (accepted.kind === 'photo')
        accepted.content = (
          await decodePhoto(accepted.content, accepted.contentType as DecodedPhoto['contentType'])
        ).content;
      const stored = await deps.storage.save(system.id, accepted);
      const record = await deps.repository.insert({
        systemId: system.id,
        uploadedBy: user.id,
        kind: accepted.kind,
        fileName: accepted.displayName,
        storedName: stored.storedName,
        contentType: accepted.contentType,
        bytes: stored.bytes,
        caption: accepted.caption,
      });
      await deps.audit.record(
        system.id,
        user,
        'system.changed',
        `uploaded ${accepted.kind} ${accepted.displayName}`,
      );
      return listing(record);
    },

    async list(user: PublicUser, systemId: string) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return (await deps.repository.list(system.id)).map(listing);
    },

    /** The stored record and an open stream of its bytes. */
    async open(user: PublicUser, systemId: string, uploadId: string) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      const record = isUuid(uploadId) ? await deps.repository.find(system.id, uploadId) : undefined;
      if (!record) throw notFound('Upload');
      return { record, stream: await deps.storage.open(system.id, record.storedName) };
    },

    /**
     * The system's newest 12 photos as the commissioning record embeds them (see `photoForRecord`), one at a
     * time so no more than one stored file is held at once; null for a photo that is missing or does not
     * decode (files stored before photos were checked may be anything).
     */
    async photos(systemId: string): Promise<CommissioningRecordPhoto[]> {
      const photos = (await deps.repository.list(systemId)).filter((u) => u.kind === 'photo').slice(0, 12);
      const prepared: CommissioningRecordPhoto[] = [];
      for (const photo of photos) {
        const raw = await readStored(systemId, photo.storedName).catch(() => null);
        prepared.push({
          caption: photo.caption || photo.fileName,
          data: raw && (await photoForRecord(raw)),
        });
      }
      return prepared;
    },
  };
}

export type UploadsService = ReturnType<typeof createUploadsService>;
