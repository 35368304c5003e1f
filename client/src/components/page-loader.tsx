import { Center, Loader } from '@mantine/core';

/** What shows while the first screen's code and data load. */
export function PageLoader() {
  return (
    <Center mih="60vh">
      <Loader size="md" aria-label="Loading" />
    </Center>
  );
}
