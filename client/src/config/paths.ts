/** One revision of one design, as the Compare designs page names it in its address (`designId.revisionNumber`). */
export interface RevisionRef {
  designId: string;
  revisionNumber: number;
}

export function revisionRefParam(ref: RevisionRef): string {
  return `${encodeURIComponent(ref.designId)}.${ref.revisionNumber}`;
}

/** The reference in `a=…` or `b=…` of the Compare designs address; null when malformed. */
export function parseRevisionRef(value: string | null): RevisionRef | null {
  const match = /^(.+)\.(\d{1,6})$/.exec(value ?? '');
  if (!match?.[1] || !match[2]) return null;
  const revisionNumber = Number(match[2]);
  return revisionNumber >= 1 ? { designId: decodeURIComponent(match[1]), revisionNumber } : null;
}

/** Every URL the client knows: screens (`path` for the router, `getHref` for links) and API endpoints. */
export const paths = {
  inbox: { path: '/inbox', getHref: () => '/inbox' },
  outbox: { path: '/outbox', getHref: () => '/outbox' },
  accounts: { path: '/admin/accounts', getHref: () => '/admin/accounts' },
  auditLog: { path: '/admin/audit-log', getHref: () => '/admin/audit-log' },
  notificationSettings: { path: '/settings/notifications', getHref: () => '/settings/notifications' },
  resetPassword: { path: '/reset-password', getHref: (token: string) => `/reset-password?token=${token}` },
  projectMembers: {
    path: '/projects/:projectId/members',
    getHref: (projectId: string) => `/projects/${encodeURIComponent(projectId)}/members`,
  },
  projectSettings: {
    path: '/projects/:projectId/settings',
    getHref: (projectId: string) => `/projects/${encodeURIComponent(projectId)}/settings`,
  },
  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string | null) =>
      redirectTo && redirectTo !== '/' ? `/sign-in?redirectTo=${encodeURIComponent(redirectTo)}` : '/sign-in',
  },
  projects: {
    path: '/',
    getHref: () => '/',
  },
  project: {
    path: '/projects/:projectId',
    getHref: (projectId: string) => `/projects/${encodeURIComponent(projectId)}`,
  },
  design: {
    path: '/projects/:projectId/designs/:designId',
    getHref: (projectId: string, designId: string, revisionNumber?: number) =>
      `/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}` +
      (revisionNumber === undefined ? '' : `?rev=${revisionNumber}`),
  },
  compareDesigns: {
    path: '/projects/:projectId/compare',
    getHref: (projectId: string, a?: RevisionRef, b?: RevisionRef) => {
      const query = [a && `a=${revisionRefParam(a)}`, b && `b=${revisionRefParam(b)}`].filter(Boolean).join('&');
      return `/projects/${encodeURIComponent(projectId)}/compare${query ? `?${query}` : ''}`;
    },
  },
  sizer: {
    path: '/projects/:projectId/sizer',
    getHref: (projectId: string) => `/projects/${encodeURIComponent(projectId)}/sizer`,
  },
  partsShelf: {
    path: '/projects/:projectId/parts',
    getHref: (projectId: string) => `/projects/${encodeURIComponent(projectId)}/parts`,
  },
  benchRuns: {
    path: '/projects/:projectId/designs/:designId/revisions/:revisionNumber/bench-runs',
    getHref: (projectId: string, designId: string, revisionNumber: number) =>
      `/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/bench-runs`,
  },
  signOff: {
    path: '/projects/:projectId/designs/:designId/revisions/:revisionNumber/sign-off',
    getHref: (projectId: string, designId: string, revisionNumber: number) =>
      `/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/sign-off`,
  },
} as const;

export const apiPaths = {
  inbox: '/api/inbox',
  outbox: '/api/outbox',
  users: '/api/users',
  user: (userId: string) => `/api/users/${encodeURIComponent(userId)}`,
  passwordResetLink: (userId: string) => `/api/users/${encodeURIComponent(userId)}/password-reset`,
  completePasswordReset: '/api/auth/password-reset',
  audit: '/api/audit',
  auditCsv: '/api/audit/export.csv',
  notificationSettings: '/api/me/notifications',
  projectMembers: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/members`,
  memberRequests: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/member-requests`,
  memberRequestDecision: (projectId: string, requestId: string, decision: 'accept' | 'decline') =>
    `/api/projects/${encodeURIComponent(projectId)}/member-requests/${encodeURIComponent(requestId)}/${decision}`,
  projectMember: (projectId: string, userId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/members/${encodeURIComponent(userId)}`,
  archiveProject: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/archive`,
  unarchiveProject: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/unarchive`,
  signIn: '/api/auth/sign-in',
  signOut: '/api/auth/sign-out',
  me: '/api/auth/me',
  projects: '/api/projects',
  project: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}`,
  health: '/api/health',
  designs: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/designs`,
  design: (projectId: string, designId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}`,
  revisions: (projectId: string, designId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions`,
  revision: (projectId: string, designId: string, revisionNumber: number) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}`,
  compareRevisions: (projectId: string, designId: string, a: number, b: number, bDesignId?: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/compare?a=${a}&b=${b}` +
    (bDesignId && bDesignId !== designId ? `&bDesignId=${encodeURIComponent(bDesignId)}` : ''),
  designTemplates: '/api/design-templates',
  evaluate: '/api/analysis/evaluate',
  simulatedFigures: (projectId: string, designId: string, revisionNumber: number) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/simulated-figures`,
  simulations: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/simulations`,
  simulation: (projectId: string, jobId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/simulations/${encodeURIComponent(jobId)}`,
  cancelSimulation: (projectId: string, jobId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/simulations/${encodeURIComponent(jobId)}/cancel`,
  parts: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/parts`,
  part: (projectId: string, partId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/parts/${encodeURIComponent(partId)}`,
  importParts: (projectId: string, dryRun: boolean) =>
    `/api/projects/${encodeURIComponent(projectId)}/parts/import?dryRun=${dryRun}`,
  exportParts: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}/parts/export.csv`,
  benchRuns: (projectId: string, designId: string, revisionNumber: number) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/bench-runs`,
  benchRun: (projectId: string, designId: string, revisionNumber: number, benchRunId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/bench-runs/${encodeURIComponent(benchRunId)}`,
  calibrations: (projectId: string, designId: string, revisionNumber: number) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/calibrations`,
  calibration: (projectId: string, designId: string, revisionNumber: number, calibrationId: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/calibrations/${encodeURIComponent(calibrationId)}`,
  /** Below a revision: `sign-off`, `submit`, `withdraw`, `approve`, `return`, `release`, `comments`, `spec-sheet.pdf`. */
  revisionAction: (projectId: string, designId: string, revisionNumber: number, action: string) =>
    `/api/projects/${encodeURIComponent(projectId)}/designs/${encodeURIComponent(designId)}/revisions/${revisionNumber}/${action}`,
} as const;

/** Keeps a post-sign-in redirect inside this app: only same-origin absolute paths are accepted. */
export function safeRedirectTarget(value: string | null | undefined): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/sign-in')) {
    return paths.projects.getHref();
  }
  return value;
}
