import { Alert, Anchor, Group, Loader, Select, Stack, Text, Title } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDocumentTitle } from '@mantine/hooks';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import type { DesignSummary } from '@ladderwright/shared/api';
import { parseRevisionRef, paths, revisionRefParam, type RevisionRef } from '../../../config/paths';
import { useCompareRevisions } from '../../../features/designs/api/compare-revisions';
import { useDesigns } from '../../../features/designs/api/get-designs';
import { RevisionComparison } from '../../../features/designs/components/revision-comparison';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { requireProjectLoader } from './root';

export const compareDesignsLoader = requireProjectLoader;

/** One side's pickers: a design of the project and one of its revisions (newest first). */
function SidePicker({
  side,
  designs,
  value,
  onChange,
}: {
  side: 'A' | 'B';
  designs: readonly DesignSummary[];
  value: RevisionRef | null;
  onChange: (ref: RevisionRef | null) => void;
}) {
  const design = designs.find((candidate) => candidate.id === value?.designId);
  const revisions = design
    ? Array.from({ length: design.latestRevisionNumber }, (_, i) => {
        const number = design.latestRevisionNumber - i;
        return { value: String(number), label: `r${number}${i === 0 ? ' (latest)' : ''}` };
      })
    : [];
  return (
    <Group gap="xs" align="flex-end" wrap="wrap">
      <Select
        label={`Design ${side}`}
        placeholder="Pick a design"
        searchable
        data={designs.map((candidate) => ({ value: candidate.id, label: candidate.name }))}
        value={value?.designId ?? null}
        onChange={(designId) => {
          const picked = designs.find((candidate) => candidate.id === designId);
          onChange(picked ? { designId: picked.id, revisionNumber: picked.latestRevisionNumber } : null);
        }}
        w={300}
        comboboxProps={{ width: 'max-content', position: 'bottom-start' }}
      />
      <Select
        label={`Revision ${side}`}
        data={revisions}
        value={value ? String(value.revisionNumber) : null}
        disabled={!design}
        allowDeselect={false}
        onChange={(number) => value && number && onChange({ ...value, revisionNumber: Number(number) })}
        w={140}
      />
    </Group>
  );
}

/** Compare designs: any revision of any design of the project beside any other, differences marked. */
export function CompareDesignsRoute() {
  const { projectId = '' } = useParams();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  useDocumentTitle(`${project.name} · Compare designs · Ladderwright`);
  const [searchParams, setSearchParams] = useSearchParams();
  const a = parseRevisionRef(searchParams.get('a'));
  const b = parseRevisionRef(searchParams.get('b'));
  const designs = useDesigns(projectId, { pageSize: 100, sort: 'name', order: 'asc' });
  const comparison = useCompareRevisions(projectId, a, b);
  const setSide = (side: 'a' | 'b', ref: RevisionRef | null) => {
    const next = new URLSearchParams(searchParams);
    if (ref) next.set(side, revisionRefParam(ref));
    else next.delete(side);
    setSearchParams(next, { replace: true });
  };
  const isSame = a && b && a.designId === b.designId && a.revisionNumber === b.revisionNumber;
  return (
    <Stack gap="md">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Text size="sm">Compare designs</Text>
      </Trail>
      <Title order={1} size="h2">
        Compare designs
      </Title>
      {designs.isError && <Alert color="red">{designs.error.message}</Alert>}
      <Group gap="xl" align="flex-end" wrap="wrap">
        <SidePicker side="A" designs={designs.data?.items ?? []} value={a} onChange={(ref) => setSide('a', ref)} />
        <SidePicker side="B" designs={designs.data?.items ?? []} value={b} onChange={(ref) => setSide('b', ref)} />
      </Group>
      {(!a || !b) && (
        <Text size="sm" c="dimmed">
          Pick a design and a revision on each side.
        </Text>
      )}
      {isSame && (
        <Text size="sm" c="dimmed">
          Pick two different revisions.
        </Text>
      )}
      {comparison.isFetching && <Loader size="sm" aria-label="Comparing" />}
      {comparison.isError && <Alert color="red">{comparison.error.message}</Alert>}
      {comparison.data && !isSame && <RevisionComparison comparison={comparison.data} />}
    </Stack>
  );
}
