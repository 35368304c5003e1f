import { Alert, Anchor, Stack, Text, Title } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDocumentTitle } from '@mantine/hooks';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { Design } from '@ladderwright/shared/designs';
import { paths } from '../../../config/paths';
import { useCreateDesign } from '../../../features/designs/api/create-design';
import { useParts } from '../../../features/parts/api/get-parts';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { DriverSizerPanel } from '../../../features/sizer/components/driver-sizer-panel';
import { SizerPanel } from '../../../features/sizer/components/sizer-panel';
import { TransformerSizerPanel } from '../../../features/sizer/components/transformer-sizer-panel';
import { requireProjectLoader } from './root';

export const sizerLoader = requireProjectLoader;

/** The Sizer of a project: ranked ladders for a target, each one click from a new design. */
export function SizerRoute() {
  const { projectId = '' } = useParams();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  useDocumentTitle(`${project.name} · Sizer · Ladderwright`);
  const navigate = useNavigate();
  const createDesign = useCreateDesign(projectId);
  const { data: shelf } = useParts(projectId);
  const startDesign = (document: Design) =>
    createDesign.mutate(
      { name: document.name, from: { kind: 'document', document } },
      { onSuccess: (design) => void navigate(paths.design.getHref(projectId, design.id)) },
    );
  return (
    <Stack gap="lg">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Text size="sm">Sizer</Text>
      </Trail>
      <Title order={1} size="h2">
        Sizer
      </Title>
      {createDesign.isError && (
        <Alert color="red" title="The design was not created">
          {createDesign.error.message}
        </Alert>
      )}
      <SizerPanel shelf={shelf ?? []} isStarting={createDesign.isPending} onStartDesign={startDesign} />
      <Title order={2} size="h3">
        Driver-fed supply
      </Title>
      <DriverSizerPanel isStarting={createDesign.isPending} onStartDesign={startDesign} />
      <Title order={2} size="h3">
        Transformer cores
      </Title>
      <TransformerSizerPanel shelf={shelf ?? []} />
    </Stack>
  );
}
