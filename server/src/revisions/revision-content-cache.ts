/** Bytes of revision content kept at most: about a hundred revisions of a 10-stage ladder (common practice, no source). */
export const REVISION_CONTENT_CACHE_BYTES = 8 * 1024 * 1024;

/**
 * The stored document and report of recently read revisions, by revision id, as the UTF-8 bytes of the tail of
 * their detail answer (`,"document":…,"report":…}`). A saved revision's content never changes (the database's
 * `revisions_keep_content` trigger refuses it) and a revision id is never reused, so an entry is never stale;
 * the least recently read entries leave first once the bytes pass `maxBytes`.
 */
export class RevisionContentCache {
  private readonly entries = new Map<string, Buffer>();
  private bytes = 0;

  constructor(private readonly maxBytes = REVISION_CONTENT_CACHE_BYTES) {}

  get(revisionId: string): Buffer | undefined {
    const entry = this.entries.get(revisionId);
    if (entry) {
      // Map keeps insertion order: move the entry to the newest end.
      this.entries.delete(revisionId);
      this.entries.set(revisionId, entry);
    }
    return entry;
  }

  set(revisionId: string, tail: Buffer): void {
    if (tail.length > this.maxBytes) return;
    const previous = this.entries.get(revisionId);
    if (previous) {
      this.bytes -= previous.length;
      this.entries.delete(revisionId);
    }
    for (const [oldestId, oldest] of this.entries) {
      if (this.bytes + tail.length <= this.maxBytes) break;
      this.entries.delete(oldestId);
      this.bytes -= oldest.length;
    }
    this.entries.set(revisionId, tail);
    this.bytes += tail.length;
  }
}
