/** The fields of a multer memory-storage upload that the server reads. */
export interface UploadedFileData {
  originalname: string;
  mimetype: string;
  size: number;
  buffer: Buffer;
}

/** Where a stored blob lives and what it is; the key is derived from the content, so a blob is never overwritten. */
export interface StoredBlob {
  key: string;
  sha256: string;
  sizeBytes: number;
}

/** Nest injection token of the blob store. */
export const BLOB_STORE = Symbol('BLOB_STORE');

/**
 * The one storage interface: content-addressed blobs. `put` is idempotent (the same bytes give the same
 * key and the existing blob is kept as it is); there is no update and no hard delete, so nothing stored is
 * changed in place. Metadata (names, owners, soft deletes) lives in PostgreSQL, not here.
 */
export interface BlobStore {
  put(content: Buffer): Promise<StoredBlob>;
  get(key: string): Promise<Buffer>;
  exists(key: string): Promise<boolean>;
}
