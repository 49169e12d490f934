import { MulterError } from 'multer';
import { AppError, invalidInput } from '../errors/app-error';

/** A multer or busboy failure as the AppError the API answers with (field 'file' unless a text field). */
export function toUploadError(error: unknown, maxBytes: number): AppError {
  if (error instanceof AppError) return error;
  if (!(error instanceof MulterError)) {
    return new AppError('invalid_input', 400, 'the upload is not a valid multipart/form-data body', 'file', {
      cause: error,
    });
  }
  switch (error.code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError('file_too_large', 413, `the file must be at most ${megabytes(maxBytes)}`, 'file');
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT':
      return invalidInput(
        'file',
        `send exactly one file, in the field "file"; got ${error.field ?? 'another'}`,
      );
    case 'LIMIT_FIELD_VALUE':
      return invalidInput(error.field ?? 'file', `${error.field ?? 'a field'} is too long`);
    default:
      return invalidInput(error.field ?? 'file', `the upload was refused: ${error.message}`);
  }
}

function megabytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Math.round(bytes / (1024 * 1024))} MB` : `${bytes} bytes`;
}
