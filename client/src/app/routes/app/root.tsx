import {
  Navigate,
  Outlet,
  redirect,
  useLocation,
  useNavigate,
  useParams,
  type LoaderFunctionArgs,
} from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import type { CurrentUser } from '@ladderwright/shared/api';
import { AppShell } from '../../../components/app-shell';
import { paths } from '../../../config/paths';
import { getMeQueryOptions, useMe } from '../../../features/auth/api/get-me';
import { useSignOut } from '../../../features/auth/api/sign-out';
import { useInbox } from '../../../features/inbox/api/get-inbox';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { useProjects } from '../../../features/projects/api/get-projects';
import { ArchivedProjectNotice } from '../../../features/projects/components/archived-project-notice';
import { ProjectNav } from '../../../features/projects/components/project-nav';
import { showNotification } from '../../../lib/show-notification';

/**
 * The signed-in user, or a redirect to sign-in that remembers the page asked for. Every loader below the shell
 * calls it first: the router runs matched loaders in parallel, and none may call the API without a session.
 */
export async function requireUser(queryClient: QueryClient, request: Request): Promise<CurrentUser> {
  const user = await queryClient.ensureQueryData(getMeQueryOptions());
  if (!user) {
    const url = new URL(request.url);
    throw redirect(paths.signIn.getHref(url.pathname + url.search));
  }
  return user;
}

export function requireUserLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };
}

/** Loader of a page inside one project: the session first, then the project (name, the user's role) in the cache. */
export function requireProjectLoader(queryClient: QueryClient) {
  return async ({ params, request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.ensureQueryData(getProjectQueryOptions(params.projectId ?? ''));
    return null;
  };
}

export function AppRoot() {
  const { data: user } = useMe();
  const projects = useProjects();
  const inbox = useInbox(Boolean(user));
  const { projectId = null } = useParams();
  const navigate = useNavigate();
  const location = useLocation();
  const signOut = useSignOut({ onSuccess: () => void navigate(paths.signIn.getHref(), { replace: true }) });

  const activeProject = projects.data?.find((project) => project.id === projectId);

  if (!user) return <Navigate to={paths.signIn.getHref(location.pathname)} replace />;

  const handleSignOut = () =>
    signOut.mutate(undefined, {
      onError: () => showNotification({ color: 'red', title: 'Sign-out failed', message: 'Try again in a moment.' }),
    });

  return (
    <AppShell
      user={user}
      onSignOut={handleSignOut}
      isSigningOut={signOut.isPending}
      inboxCount={inbox.data?.actionCount ?? 0}
      navigation={<ProjectNav projects={projects.data} activeProjectId={projectId} isLoading={projects.isPending} />}
    >
      {activeProject?.isArchived && <ArchivedProjectNotice project={activeProject} />}
      <Outlet />
    </AppShell>
  );
}
