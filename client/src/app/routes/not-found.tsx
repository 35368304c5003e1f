import { Button, Center, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import { Link } from 'react-router-dom';
import { paths } from '../../config/paths';

export function NotFoundRoute() {
  useDocumentTitle('Page not found · Ladderwright');
  return (
    <Center mih="70vh" p="md">
      <Stack align="center" gap="sm">
        <Title order={1} size="h2">
          Page not found
        </Title>
        <Text c="dimmed">There is nothing at this address.</Text>
        <Button component={Link} to={paths.projects.getHref()} variant="light">
          Go to projects
        </Button>
      </Stack>
    </Center>
  );
}
