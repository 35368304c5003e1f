import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { CurrentUser } from '@ladderwright/shared/api';
import { renderWithApp } from '../testing/render';
import { AppShell } from './app-shell';

const reviewer: CurrentUser = {
  id: 'u-2',
  email: 'reviewer@northfold.test',
  displayName: 'Northfold Reviewer',
  role: 'reviewer',
};

function renderShell(onSignOut = vi.fn()) {
  renderWithApp(
    <AppShell user={reviewer} onSignOut={onSignOut} navigation={<a href="/projects/p-1">Detector tube bias</a>}>
      <p>page body</p>
    </AppShell>,
  );
  return onSignOut;
}

describe('AppShell', () => {
  it('shows the product name, the navigation, the page and the high-voltage caution', () => {
    renderShell();

    expect(screen.getByRole('link', { name: 'Ladderwright home' })).toHaveTextContent('Ladderwright');
    expect(screen.getByRole('link', { name: 'Detector tube bias' })).toBeInTheDocument();
    expect(screen.getByText('page body')).toBeInTheDocument();
    const caution = screen.getByRole('note', { name: 'High-voltage caution' });
    expect(caution).toHaveTextContent('High voltage can kill.');
    expect(caution).toHaveTextContent(/charge after switch-off/);
    expect(caution).toHaveTextContent('the applicable standard, local codes and licensed practice govern');
  });

  it('shows who is signed in and signs out from the user menu', async () => {
    const onSignOut = renderShell();

    const account = screen.getByRole('button', { name: 'Account: Northfold Reviewer' });
    expect(account).toHaveTextContent('reviewer');
    fireEvent.click(account);
    const signOut = await screen.findByRole('menuitem', { name: 'Sign out' });
    expect(screen.getByText('reviewer@northfold.test')).toBeInTheDocument();

    fireEvent.click(signOut);
    expect(onSignOut).toHaveBeenCalledTimes(1);
  });

  it('switches between light and dark schemes', () => {
    renderShell();

    fireEvent.click(screen.getByRole('button', { name: 'Switch to dark scheme' }));
    expect(document.documentElement).toHaveAttribute('data-mantine-color-scheme', 'dark');
    fireEvent.click(screen.getByRole('button', { name: 'Switch to light scheme' }));
    expect(document.documentElement).toHaveAttribute('data-mantine-color-scheme', 'light');
  });

  it('links to the Inbox for everyone and to the Outbox only for admins', () => {
    const { unmount } = renderWithApp(
      <AppShell user={reviewer} onSignOut={vi.fn()} navigation={null}>
        <p>page body</p>
      </AppShell>,
    );
    expect(screen.getByRole('link', { name: 'Inbox' })).toHaveAttribute('href', '/inbox');
    expect(screen.queryByRole('link', { name: 'Outbox' })).not.toBeInTheDocument();
    unmount();

    renderWithApp(
      <AppShell user={{ ...reviewer, role: 'admin' }} onSignOut={vi.fn()} navigation={null}>
        <p>page body</p>
      </AppShell>,
    );
    expect(screen.getByRole('link', { name: 'Outbox' })).toHaveAttribute('href', '/outbox');
  });
});
