import { Button, Center, Code, Group, Stack, Text, Title } from '@mantine/core';
import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { paths } from '../config/paths';
import { isApiError } from '../lib/api-client';

function describe(error: unknown): { heading: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    return { heading: error.status === 404 ? 'Page not found' : 'Something went wrong', detail: error.statusText };
  }
  if (isApiError(error)) {
    return {
      heading: error.status === 404 ? 'Not found' : 'The server could not complete the request',
      detail: error.body.message,
    };
  }
  if (error instanceof Error) return { heading: 'Something went wrong', detail: error.message };
  return { heading: 'Something went wrong', detail: 'An unexpected error occurred.' };
}

export interface ErrorFallbackProps {
  error: unknown;
}

/** A full-page message for an error nothing closer could handle, with a way to try again. */
export function ErrorFallback({ error }: ErrorFallbackProps) {
  const { heading, detail } = describe(error);
  return (
    <Center mih="60vh" p="md">
      <Stack align="center" gap="sm" maw={520}>
        <Title order={1} size="h2">
          {heading}
        </Title>
        {detail && (
          <Text c="dimmed" ta="center">
            <Code>{detail}</Code>
          </Text>
        )}
        <Group gap="sm">
          <Button component="a" href={paths.projects.getHref()} variant="default">
            Go to projects
          </Button>
          <Button variant="light" onClick={() => window.location.reload()}>
            Reload
          </Button>
        </Group>
      </Stack>
    </Center>
  );
}

/** `errorElement` for the router: reads the route error and shows `ErrorFallback`. */
export function RouteErrorFallback() {
  return <ErrorFallback error={useRouteError()} />;
}
