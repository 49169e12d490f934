import type { PublicUser, UploadListing } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { invalidInput, notFound } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
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

    /** Photo bytes for the commissioning record. */
    async photos(systemId: string): Promise<{ caption: string; data: Buffer }[]> {
      const photos = (await deps.repository.list(systemId)).filter((u) => u.kind === 'photo').slice(0, 12);
      const read = async (storedName: string) => {
        const chunks: Buffer[] = [];
        for await (const chunk of await deps.storage.open(systemId, storedName)) chunks.push(chunk as Buffer);
        return Buffer.concat(chunks);
      };
      return Promise.all(
        photos.map(async (p) => ({ caption: p.caption || p.fileName, data: await read(p.storedName) })),
      );
    },
  };
}

export type UploadsService = ReturnType<typeof createUploadsService>;
