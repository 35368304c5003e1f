/** Every URL the client knows: screens (`path` for the router, `getHref` for links) and API endpoints. */
export const paths = {
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
} as const;

export const apiPaths = {
  signIn: '/api/auth/sign-in',
  signOut: '/api/auth/sign-out',
  me: '/api/auth/me',
  projects: '/api/projects',
  project: (projectId: string) => `/api/projects/${encodeURIComponent(projectId)}`,
  health: '/api/health',
} as const;

/** Keeps a post-sign-in redirect inside this app: only same-origin absolute paths are accepted. */
export function safeRedirectTarget(value: string | null | undefined): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/sign-in')) {
    return paths.projects.getHref();
  }
  return value;
}
