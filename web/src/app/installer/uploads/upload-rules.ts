import type { UploadListing } from '@cellwarden/shared';

/** Largest file the server takes, bytes (10 MB). */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

/** Content types the server takes, and the kind each is filed as. */
export const UPLOAD_TYPES: Readonly<Record<string, UploadListing['kind']>> = {
  'image/jpeg': 'photo',
  'image/png': 'photo',
  'text/plain': 'log',
  'text/csv': 'log',
};

/** Why a file cannot be uploaded, in words naming the file, or null when it can. */
export function uploadProblem(file: Pick<File, 'name' | 'size' | 'type'>): string | null {
  if (!(file.type in UPLOAD_TYPES)) {
    return `${file.name} is ${file.type || 'of an unknown type'}; upload a JPEG or PNG photo, or a plain-text or CSV log.`;
  }
  if (file.size > MAX_UPLOAD_BYTES) {
    return `${file.name} is ${formatBytes(file.size)}; the limit is 10 MB. Shrink the photo or split the log.`;
  }
  return null;
}

/** Bytes in the units people read (binary multiples, as file managers show them). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
