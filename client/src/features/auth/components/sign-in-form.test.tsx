import { fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ApiErrorBody, SignInResponse } from '@ladderwright/shared/api';
import { queryKeys } from '../../../lib/query-keys';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { SignInForm } from './sign-in-form';

const engineer: SignInResponse = {
  user: { id: 'u-1', email: 'engineer@northfold.test', displayName: 'Northfold Engineer', role: 'engineer' },
};

function fillAndSubmit(email: string, password: string) {
  fireEvent.change(screen.getByLabelText(/^e-mail/i, { selector: 'input' }), { target: { value: email } });
  fireEvent.change(screen.getByLabelText(/^password/i, { selector: 'input' }), { target: { value: password } });
  fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('SignInForm', () => {
  const fetchMock = vi.fn<typeof fetch>();

  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });
  afterEach(() => vi.unstubAllGlobals());

  it('shows both field errors and sends nothing when submitted empty', async () => {
    renderWithApp(<SignInForm onSuccess={vi.fn()} />);
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Enter your e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(screen.getByLabelText(/^e-mail/i, { selector: 'input' })).toHaveAttribute('aria-invalid', 'true');
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('rejects an e-mail address without a domain before calling the server', async () => {
    renderWithApp(<SignInForm onSuccess={vi.fn()} />);
    fillAndSubmit('engineer', 'Northfold-demo-1');

    expect(await screen.findByText('Enter a valid e-mail address')).toBeInTheDocument();
    expect(screen.queryByText('Enter your password')).not.toBeInTheDocument();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("shows the server's message when the credentials are refused (401)", async () => {
    const refusal: ApiErrorBody = {
      statusCode: 401,
      code: 'invalid_credentials',
      message: 'E-mail or password is wrong.',
    };
    fetchMock.mockResolvedValueOnce(jsonResponse(refusal, 401));
    const onSuccess = vi.fn();
    renderWithApp(<SignInForm onSuccess={onSuccess} />);
    fillAndSubmit('engineer@northfold.test', 'wrong-password');

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('E-mail or password is wrong.');
    expect(onSuccess).not.toHaveBeenCalled();
    const [url, init] = fetchMock.mock.calls[0] ?? [];
    expect(url).toBe('/api/auth/sign-in');
    expect(init?.method).toBe('POST');
    expect(init?.credentials).toBe('include');
    expect(JSON.parse(String(init?.body))).toEqual({ email: 'engineer@northfold.test', password: 'wrong-password' });
  });

  it('tells how long to wait when sign-in is throttled (429 with Retry-After)', async () => {
    const throttled: ApiErrorBody = { statusCode: 429, code: 'throttled', message: 'Too many sign-in attempts.' };
    fetchMock.mockResolvedValueOnce(jsonResponse(throttled, 429, { 'Retry-After': '30' }));
    renderWithApp(<SignInForm onSuccess={vi.fn()} />);
    fillAndSubmit('engineer@northfold.test', 'Northfold-demo-1');

    expect(await screen.findByRole('alert')).toHaveTextContent('Too many sign-in attempts. Try again in 30 s.');
  });

  it('puts a 400 answer that names a field under that field', async () => {
    const bad: ApiErrorBody = {
      statusCode: 400,
      code: 'invalid_argument',
      message: 'email must be an email',
      field: 'email',
    };
    fetchMock.mockResolvedValueOnce(jsonResponse(bad, 400));
    renderWithApp(<SignInForm onSuccess={vi.fn()} />);
    fillAndSubmit('engineer@northfold.test', 'Northfold-demo-1');

    expect(await screen.findByText('email must be an email')).toBeInTheDocument();
    expect(screen.getByLabelText(/^e-mail/i, { selector: 'input' })).toHaveAttribute('aria-invalid', 'true');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('reports the signed-in user and primes the session query on success', async () => {
    fetchMock.mockResolvedValueOnce(jsonResponse(engineer));
    const onSuccess = vi.fn();
    const { queryClient } = renderWithApp(<SignInForm onSuccess={onSuccess} />);
    fillAndSubmit('  engineer@northfold.test ', 'Northfold-demo-1');

    await waitFor(() => expect(onSuccess).toHaveBeenCalledWith(engineer));
    expect(queryClient.getQueryData(queryKeys.auth.me())).toEqual(engineer.user);
    expect(JSON.parse(String(fetchMock.mock.calls[0]?.[1]?.body)).email).toBe('engineer@northfold.test');
  });
});
