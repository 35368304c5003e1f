/** Hierarchical query keys: invalidate a prefix (e.g. `queryKeys.projects.all`) to refresh everything below it. */
export const queryKeys = {
  inbox: { all: ['inbox'] as const, mine: () => [...queryKeys.inbox.all, 'mine'] as const },
  outbox: { all: ['outbox'] as const, list: () => [...queryKeys.outbox.all, 'list'] as const },
  auth: {
    all: ['auth'] as const,
    me: () => [...queryKeys.auth.all, 'me'] as const,
    notifications: () => [...queryKeys.auth.all, 'notifications'] as const,
  },
  admin: {
    all: ['admin'] as const,
    users: (query: object) => [...queryKeys.admin.all, 'users', query] as const,
    audit: (query: object) => [...queryKeys.admin.all, 'audit', query] as const,
  },
  projects: {
    all: ['projects'] as const,
    list: () => [...queryKeys.projects.all, 'list'] as const,
    detail: (projectId: string) => [...queryKeys.projects.all, 'detail', projectId] as const,
    memberRequests: (projectId: string) => [...queryKeys.projects.all, 'memberRequests', projectId] as const,
  },
  designs: {
    all: ['designs'] as const,
    project: (projectId: string) => [...queryKeys.designs.all, projectId] as const,
    list: (projectId: string, query: object) => [...queryKeys.designs.project(projectId), 'list', query] as const,
    detail: (projectId: string, designId: string) =>
      [...queryKeys.designs.project(projectId), 'detail', designId] as const,
    revision: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.designs.detail(projectId, designId), 'revision', revisionNumber] as const,
    compare: (projectId: string, designId: string, a: number, bDesignId: string, b: number) =>
      [...queryKeys.designs.detail(projectId, designId), 'compare', a, bDesignId, b] as const,
    templates: () => [...queryKeys.designs.all, 'templates'] as const,
  },
  simulations: {
    all: ['simulations'] as const,
    job: (projectId: string, jobId: string) => [...queryKeys.simulations.all, projectId, jobId] as const,
    /** The current full simulation of a revision (its figures stand for the estimate); refreshed when a run ends. */
    currentAll: ['simulations', 'current'] as const,
    current: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.simulations.currentAll, projectId, designId, revisionNumber] as const,
  },
  parts: {
    all: ['parts'] as const,
    project: (projectId: string) => [...queryKeys.parts.all, projectId] as const,
    list: (projectId: string, query: object) => [...queryKeys.parts.project(projectId), 'list', query] as const,
  },
  benchRuns: {
    all: ['benchRuns'] as const,
    revision: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.benchRuns.all, projectId, designId, revisionNumber] as const,
    detail: (projectId: string, designId: string, revisionNumber: number, benchRunId: string) =>
      [...queryKeys.benchRuns.revision(projectId, designId, revisionNumber), benchRunId] as const,
  },
  calibrations: {
    all: ['calibrations'] as const,
    revision: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.calibrations.all, projectId, designId, revisionNumber] as const,
    detail: (projectId: string, designId: string, revisionNumber: number, calibrationId: string) =>
      [...queryKeys.calibrations.revision(projectId, designId, revisionNumber), calibrationId] as const,
  },
  signOff: {
    all: ['signOff'] as const,
    revision: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.signOff.all, projectId, designId, revisionNumber] as const,
    state: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.signOff.revision(projectId, designId, revisionNumber), 'state'] as const,
    comments: (projectId: string, designId: string, revisionNumber: number) =>
      [...queryKeys.signOff.revision(projectId, designId, revisionNumber), 'comments'] as const,
  },
} as const;
