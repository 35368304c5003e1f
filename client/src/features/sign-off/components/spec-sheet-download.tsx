import { Button, Stack, Text } from '@mantine/core';
import { canInProject, type ProjectRole } from '@ladderwright/shared/auth';
import type { RevisionState } from '@ladderwright/shared/reviews';
import { useDownloadSpecSheet } from '../api/download-spec-sheet';
import { SignOffError } from './sign-off-error';

export interface SpecSheetDownloadProps {
  projectId: string;
  designId: string;
  designName: string;
  revisionNumber: number;
  state: RevisionState;
  projectRole: ProjectRole | null;
}

function fileNameOf(designName: string, revisionNumber: number): string {
  const slug = designName
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
  return `${slug || 'design'}-r${revisionNumber}-spec-sheet.pdf`;
}

/** The Spec sheet (PDF): released revisions for leads; other states for engineers and leads, marked NOT RELEASED. */
export function SpecSheetDownload({
  projectId,
  designId,
  designName,
  revisionNumber,
  state,
  projectRole,
}: SpecSheetDownloadProps) {
  const isReleased = state === 'released';
  const download = useDownloadSpecSheet(projectId, designId, revisionNumber, fileNameOf(designName, revisionNumber));
  const isAllowed =
    projectRole !== null && canInProject(projectRole, isReleased ? 'specSheet.export' : 'specSheet.exportDraft');
  return (
    <Stack gap="xs">
      <Text size="sm">
        {isReleased
          ? 'The supplier document of this released revision.'
          : 'This revision is not released: every page of its sheet is marked NOT RELEASED.'}
      </Text>
      {isAllowed ? (
        <Button variant="default" w="fit-content" loading={download.isPending} onClick={() => download.mutate()}>
          {isReleased ? 'Download Spec sheet (PDF)' : 'Download Spec sheet (PDF, NOT RELEASED)'}
        </Button>
      ) : (
        <Text size="sm" c="dimmed">
          {isReleased ? 'Leads download released Spec sheets.' : 'Engineers and leads download unreleased Spec sheets.'}
        </Text>
      )}
      <SignOffError error={download.error} fallbackTitle="The Spec sheet could not be made" />
    </Stack>
  );
}
