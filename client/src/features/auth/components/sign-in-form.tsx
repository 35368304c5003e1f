import { Alert, Button, PasswordInput, Stack, TextInput } from '@mantine/core';
import { isEmail, isNotEmpty, useForm } from '@mantine/form';
import type { SignInRequest, SignInResponse } from '@ladderwright/shared/api';
import { isApiError } from '../../../lib/api-client';
import { useSignIn } from '../api/sign-in';

export interface SignInFormProps {
  onSuccess: (response: SignInResponse) => void;
}

function describeFailure(error: unknown): string {
  if (!isApiError(error)) return 'The server could not be reached. Check the connection and try again.';
  if (error.status === 429) {
    const wait = error.retryAfterS === null ? 'a moment' : `${Math.ceil(error.retryAfterS)} s`;
    return `${error.body.message} Try again in ${wait}.`;
  }
  return error.body.message;
}

export function SignInForm({ onSuccess }: SignInFormProps) {
  const form = useForm<SignInRequest>({
    mode: 'controlled',
    initialValues: { email: '', password: '' },
    validate: {
      email: (value) =>
        isNotEmpty('Enter your e-mail address')(value.trim()) ?? isEmail('Enter a valid e-mail address')(value.trim()),
      password: isNotEmpty('Enter your password'),
    },
  });
  const signIn = useSignIn({ onSuccess });

  const handleSubmit = form.onSubmit((values) => {
    signIn.mutate(
      { email: values.email.trim(), password: values.password },
      {
        onError: (error) => {
          if (isApiError(error) && error.status === 400 && error.body.field && error.body.field in values) {
            form.setFieldError(error.body.field, error.body.message);
          }
        },
      },
    );
  });

  const isFieldError = isApiError(signIn.error) && signIn.error.status === 400 && Boolean(signIn.error.body.field);

  return (
    <form onSubmit={handleSubmit} noValidate aria-label="Sign in">
      <Stack gap="md">
        {signIn.isError && !isFieldError && (
          <Alert color="red" variant="light" role="alert" title="Sign-in failed">
            {describeFailure(signIn.error)}
          </Alert>
        )}
        <TextInput
          label="E-mail"
          type="email"
          autoComplete="username"
          placeholder="name@company.example"
          withAsterisk
          key={form.key('email')}
          {...form.getInputProps('email')}
        />
        <PasswordInput
          label="Password"
          autoComplete="current-password"
          withAsterisk
          key={form.key('password')}
          {...form.getInputProps('password')}
        />
        <Button type="submit" loading={signIn.isPending} fullWidth>
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
