import { Stack, Table, Text } from '@mantine/core';
import { fittedParameterText, type Calibration } from '@ladderwright/shared/api';
import { formatDateTime } from '../../../lib/format-date';
import { useCalibrations } from '../api/get-calibrations';

function fittedText(calibration: Calibration): string {
  if (calibration.status !== 'succeeded' || !calibration.result) return calibration.status;
  const confidencePct = (calibration.result.confidence * 100).toFixed(0);
  return `${calibration.result.parameters.map(fittedParameterText).join('; ')} (${confidencePct} % intervals)`;
}

/** The calibrations of a revision, newest first: when, against which runs, what was fitted, any warning. */
export function CalibrationList({
  projectId,
  designId,
  revisionNumber,
}: {
  projectId: string;
  designId: string;
  revisionNumber: number;
}) {
  const calibrations = useCalibrations(projectId, designId, revisionNumber);
  const rows = calibrations.data ?? [];
  if (rows.length === 0)
    return (
      <Text size="sm">
        No calibration of this revision. One is run on its Bench runs page, fitting chosen parameters to uploaded runs.
      </Text>
    );
  return (
    <Stack gap="xs">
      <Table aria-label="Calibrations">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>When</Table.Th>
            <Table.Th>Bench runs</Table.Th>
            <Table.Th>Fitted</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {rows.map((calibration) => (
            <Table.Tr key={calibration.id}>
              <Table.Td>{formatDateTime(calibration.createdAt)}</Table.Td>
              <Table.Td>{calibration.input.runs.map((run) => run.label).join(', ')}</Table.Td>
              <Table.Td>
                {fittedText(calibration)}
                {calibration.result?.warnings.length ? ' — identifiability warning' : ''}
                {calibration.draftRevisionNumber !== null ? ` → revision ${calibration.draftRevisionNumber}` : ''}
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Stack>
  );
}
