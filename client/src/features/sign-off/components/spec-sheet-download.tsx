import { Button, Stack, Text } from '@mantine/core';
import { canInProject, type ProjectRole } from '@ladderwright/shared/auth';
import type { RevisionState } from '@ladderwright/shared/reviews';
import { type SheetKind, useDownloadSpecSheet } from '../api/download-spec-sheet';
import { SignOffError } from './sign-off-error';

export interface SpecSheetDownloadProps {
  projectId: string;
  designId: string;
  designName: string;
  revisionNumber: number;
  state: RevisionState;
  projectRole: ProjectRole | null;
  /** The supply's Spec sheet (default) or the Transformer sheet for the magnetics supplier. */
  sheet?: SheetKind;
}

const SHEET_NAMES: Record<SheetKind, { title: string; file: string }> = {
  supply: { title: 'Spec sheet', file: 'spec-sheet' },
  transformer: { title: 'Transformer sheet', file: 'transformer-sheet' },
};

function fileNameOf(designName: string, revisionNumber: number, sheet: SheetKind): string {
  const slug = designName
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
  return `${slug || 'design'}-r${revisionNumber}-${SHEET_NAMES[sheet].file}.pdf`;
}

/**
 * The Spec sheet or the Transformer sheet (PDF): released revisions for leads; other states for engineers and
 * leads, marked NOT RELEASED.
 */
export function SpecSheetDownload({
  projectId,
  designId,
  designName,
  revisionNumber,
  state,
  projectRole,
  sheet = 'supply',
}: SpecSheetDownloadProps) {
  const isReleased = state === 'released';
  const title = SHEET_NAMES[sheet].title;
  const download = useDownloadSpecSheet(
    projectId,
    designId,
    revisionNumber,
    fileNameOf(designName, revisionNumber, sheet),
    sheet,
  );
  const isAllowed =
    projectRole !== null && canInProject(projectRole, isReleased ? 'specSheet.export' : 'specSheet.exportDraft');
  return (
    <Stack gap="xs">
      <Text size="sm">
        {isReleased
          ? sheet === 'supply'
            ? 'The supplier document of this released revision.'
            : 'The magnetics supplier’s document of this released revision.'
          : 'This revision is not released: every page of its sheet is marked NOT RELEASED.'}
      </Text>
      {isAllowed ? (
        <Button variant="default" w="fit-content" loading={download.isPending} onClick={() => download.mutate()}>
          {isReleased ? `Download ${title} (PDF)` : `Download ${title} (PDF, NOT RELEASED)`}
        </Button>
      ) : (
        <Text size="sm" c="dimmed">
          {isReleased ? `Leads download released ${title}s.` : `Engineers and leads download unreleased ${title}s.`}
        </Text>
      )}
      <SignOffError error={download.error} fallbackTitle={`The ${title} could not be made`} />
    </Stack>
  );
}
