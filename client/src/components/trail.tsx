import { Children, Fragment, type ReactNode } from 'react';
import { Group, Text } from '@mantine/core';

/** Where a page sits: its links up the hierarchy (projects, the project, the design), separated by slashes. */
export function Trail({ children }: { children: ReactNode }) {
  const items = Children.toArray(children);
  return (
    <Group component="nav" aria-label="Where this page sits" gap="xs" wrap="wrap">
      {items.map((item, index) => (
        <Fragment key={index}>
          {index > 0 && (
            <Text size="sm" c="dimmed" aria-hidden="true">
              /
            </Text>
          )}
          {item}
        </Fragment>
      ))}
    </Group>
  );
}
