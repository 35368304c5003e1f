import type { ProjectRole } from '@ladderwright/shared/auth';

/** A person's role in a project and whether the project is archived; null for a non-member. */
export type MemberStanding = { role: ProjectRole; isArchived: boolean } | null;

const MAX_ENTRIES = 20_000;

/**
 * Members' standings read in the last `ttlMs`, by project and person, so that the project guard of a request
 * costs a map lookup rather than a query. Only a standing is kept, never "not a member": adding a member needs
 * no forgetting. A change of role, a removal or an archiving on this instance forgets the project's entries when
 * it commits; other instances see it when their entry ages out (the `SESSION_CACHE_MS` of sessions). A lookup
 * started before a change never stores its answer after it (`epoch`).
 */
export class MemberStandingCache {
  private readonly entries = new Map<string, { standing: NonNullable<MemberStanding>; readAtMs: number }>();
  private epoch = 0;

  constructor(private readonly ttlMs: number) {}

  static key(projectId: string, userId: string): string {
    return `${projectId}/${userId}`;
  }

  /** The cached standing, or undefined when there is none younger than the time to live. */
  get(key: string, nowMs: number): MemberStanding | undefined {
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    if (nowMs - entry.readAtMs < this.ttlMs) return entry.standing;
    this.entries.delete(key);
    return undefined;
  }

  /** The epoch a lookup starts in; `set` stores only answers of lookups started in the current one. */
  currentEpoch(): number {
    return this.epoch;
  }

  set(key: string, standing: MemberStanding, startedInEpoch: number, readAtMs: number): void {
    if (this.ttlMs === 0 || standing === null || startedInEpoch !== this.epoch) return;
    if (this.entries.size >= MAX_ENTRIES) {
      // Map keeps insertion order: drop the oldest tenth.
      let drop = MAX_ENTRIES / 10;
      for (const oldest of this.entries.keys()) {
        this.entries.delete(oldest);
        if (--drop === 0) break;
      }
    }
    this.entries.set(key, { standing, readAtMs });
  }

  /** Forgets every cached standing in the project (a member's role changed, a member left, it was archived). */
  forgetProject(projectId: string): void {
    this.epoch += 1;
    const prefix = `${projectId}/`;
    for (const key of this.entries.keys()) {
      if (key.startsWith(prefix)) this.entries.delete(key);
    }
  }
}
