import { Alert } from '@mantine/core';
import { isApiError } from '../../../lib/api-client';

function headingOf(error: Error, fallback: string): string {
  if (!isApiError(error)) return fallback;
  if (error.status === 409) return 'Refused: the Sign-off does not allow this now';
  if (error.status === 403) return 'Not permitted for your role';
  if (error.status === 400) return 'Not accepted';
  return fallback;
}

/** A refused Sign-off request: the server's reason (409 carries why), with its status in words. */
export function SignOffError({ error, fallbackTitle }: { error: Error | null; fallbackTitle: string }) {
  if (!error) return null;
  return (
    <Alert color="red" title={headingOf(error, fallbackTitle)} role="alert">
      {error.message}
      {isApiError(error) ? ` (HTTP ${error.status})` : ''}
    </Alert>
  );
}
