import { createHash, randomUUID } from 'node:crypto';
import { access, mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { DomainError } from '@ladderwright/shared/errors';
import type { BlobStore, StoredBlob } from './storage.types';

const KEY_PATTERN = /^[0-9a-f]{64}$/;

/**
 * Blobs on local disk under `<root>/<first two hex digits>/<sha256>`. A new blob is written to a unique
 * temporary name and renamed into place, so a reader never sees half a file; an existing blob is kept.
 */
export class LocalDiskBlobStore implements BlobStore {
  constructor(private readonly root: string) {}

  private pathOf(key: string): string {
    if (!KEY_PATTERN.test(key)) throw new DomainError('invalid_argument', 'Not a stored file key', 'key');
    return join(this.root, key.slice(0, 2), key);
  }

  async put(content: Buffer): Promise<StoredBlob> {
    const sha256 = createHash('sha256').update(content).digest('hex');
    const path = this.pathOf(sha256);
    if (!(await this.exists(sha256))) {
      await mkdir(join(this.root, sha256.slice(0, 2)), { recursive: true });
      const temporary = join(this.root, sha256.slice(0, 2), `.${sha256}.${randomUUID()}.partial`);
      await writeFile(temporary, content, { flag: 'wx' });
      await rename(temporary, path);
    }
    return { key: sha256, sha256, sizeBytes: content.length };
  }

  async get(key: string): Promise<Buffer> {
    try {
      return await readFile(this.pathOf(key));
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT')
        throw new DomainError('not_found', 'Stored file not found', 'key');
      throw error;
    }
  }

  async exists(key: string): Promise<boolean> {
    try {
      await access(this.pathOf(key));
      return true;
    } catch {
      return false;
    }
  }
}
