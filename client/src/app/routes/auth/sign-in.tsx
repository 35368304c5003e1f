import { Center, Paper, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import { redirect, useNavigate, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { HvCaution } from '../../../components/hv-caution';
import { safeRedirectTarget } from '../../../config/paths';
import { getMeQueryOptions } from '../../../features/auth/api/get-me';
import { SignInForm } from '../../../features/auth/components/sign-in-form';

/** A user who already has a session goes straight on to where they were headed. */
export function signInLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData(getMeQueryOptions());
    if (user) throw redirect(safeRedirectTarget(new URL(request.url).searchParams.get('redirectTo')));
    return null;
  };
}

export function SignInRoute() {
  useDocumentTitle('Sign in · Ladderwright');
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const redirectTo = safeRedirectTarget(searchParams.get('redirectTo'));

  return (
    <Stack gap={0} mih="100vh">
      <HvCaution />
      <Center style={{ flexGrow: 1 }} p="md">
        <Paper withBorder shadow="sm" radius="md" p="xl" w="100%" maw={400}>
          <Stack gap="lg">
            <div>
              <Title order={1} size="h2">
                Ladderwright
              </Title>
              <Text c="dimmed" size="sm">
                Sign in to your workbench for high-voltage DC supply design.
              </Text>
            </div>
            <SignInForm onSuccess={() => void navigate(redirectTo, { replace: true })} />
          </Stack>
        </Paper>
      </Center>
    </Stack>
  );
}
