import { DomainError } from '@ladderwright/shared/errors';
import type { UploadedFileData } from './storage.types';

const TEXT_TYPES = new Set([
  'text/csv',
  'text/plain',
  'application/csv',
  'application/vnd.ms-excel',
  'application/octet-stream',
]);

/** A CSV upload: a .csv or .txt name, a text-like content type, UTF-8 text without NUL bytes. Returns the text. */
export function requireCsvText(file: UploadedFileData | undefined, field: string): string {
  if (!file) throw new DomainError('invalid_argument', `${field} is required: attach a CSV file`, field);
  if (!/\.(csv|txt)$/i.test(file.originalname) || !TEXT_TYPES.has(file.mimetype.toLowerCase())) {
    throw new DomainError(
      'invalid_argument',
      `${field} must be a CSV file (.csv, text/csv); got ${file.originalname} (${file.mimetype})`,
      field,
    );
  }
  if (file.buffer.includes(0)) throw new DomainError('invalid_argument', `${field} is not a text file`, field);
  const text = new TextDecoder('utf-8', { fatal: false }).decode(file.buffer);
  if (text.includes('\uFFFD')) throw new DomainError('invalid_argument', `${field} is not UTF-8 text`, field);
  return text.replace(/^\uFEFF/, '');
}

export type PhotoType = 'image/png' | 'image/jpeg';

/** The photo type from the file's first bytes (PNG signature or JPEG SOI marker); the declared type must agree. */
export function requirePhoto(file: UploadedFileData, field: string): PhotoType {
  const bytes = file.buffer;
  const isPng =
    bytes.length > 8 && bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  const isJpeg = bytes.length > 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff;
  const detected: PhotoType | null = isPng ? 'image/png' : isJpeg ? 'image/jpeg' : null;
  if (!detected) {
    throw new DomainError(
      'invalid_argument',
      `${field}: ${file.originalname} is not a PNG or JPEG image (checked by its first bytes)`,
      field,
    );
  }
  const declared = file.mimetype.toLowerCase().replace('image/jpg', 'image/jpeg');
  if (declared !== detected && declared !== 'application/octet-stream') {
    throw new DomainError(
      'invalid_argument',
      `${field}: ${file.originalname} is declared ${file.mimetype} but its content is ${detected}`,
      field,
    );
  }
  return detected;
}
