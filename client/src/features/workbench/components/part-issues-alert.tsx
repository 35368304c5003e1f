import { Alert, List, Text } from '@mantine/core';
import type { FieldIssue } from '@ladderwright/shared/errors';
import { documentFieldLabel } from '@ladderwright/shared/designs';

/** The part codes of a design that are not on its project's Parts shelf, each under its field's label. */
export function PartIssuesAlert({ issues }: { issues: readonly FieldIssue[] }) {
  return (
    <Alert color="ember" title="Part codes not on this project's Parts shelf" mb="sm">
      <Text size="sm">Checked on the ratings written in the design instead:</Text>
      <List size="sm">
        {issues.map((partIssue) => (
          <List.Item key={partIssue.path}>
            {documentFieldLabel(partIssue.path).label}: {partIssue.message}
          </List.Item>
        ))}
      </List>
    </Alert>
  );
}
