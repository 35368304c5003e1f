import { useState } from 'react';
import { Alert, Anchor, Button, PasswordInput, Stack } from '@mantine/core';
import { Link } from 'react-router-dom';
import { passwordPolicyProblem } from '@ladderwright/shared/auth';
import { paths } from '../../../config/paths';
import { useCompletePasswordReset } from '../api/complete-password-reset';

/** Sets a new password with the token of a one-time link. */
export function NewPasswordForm({ token }: { token: string }) {
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const complete = useCompletePasswordReset();
  const problem = password ? passwordPolicyProblem(password) : null;
  const isMismatch = repeat !== '' && repeat !== password;

  if (complete.isSuccess) {
    return (
      <Alert color="verdigris" title="Password set">
        Your new password is in place and your other sessions have ended.{' '}
        <Anchor component={Link} to={paths.signIn.getHref()}>
          Sign in
        </Anchor>
      </Alert>
    );
  }
  return (
    <form
      onSubmit={(event) => {
        event.preventDefault();
        complete.mutate({ token, password });
      }}
    >
      <Stack gap="sm">
        <PasswordInput
          label="New password"
          description="At least 10 characters with a letter and a digit"
          required
          value={password}
          error={problem ? `Password ${problem}` : undefined}
          onChange={(event) => setPassword(event.currentTarget.value)}
        />
        <PasswordInput
          label="New password again"
          required
          value={repeat}
          error={isMismatch ? 'The two entries differ' : undefined}
          onChange={(event) => setRepeat(event.currentTarget.value)}
        />
        {complete.error && <Alert color="red">{complete.error.message}</Alert>}
        <Button type="submit" loading={complete.isPending} disabled={!password || !!problem || repeat !== password}>
          Set the password
        </Button>
      </Stack>
    </form>
  );
}
