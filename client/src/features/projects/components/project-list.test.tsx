import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { ProjectSummary } from '@ladderwright/shared/api';
import { renderWithApp } from '../../../testing/render';
import { ProjectList } from './project-list';

const projects: ProjectSummary[] = [
  {
    id: 'p-ionizer',
    name: 'Cleanroom ionizer bar',
    productLine: 'Ionizers',
    description: 'About 6 kV negative, tens of microamps, from 12 V.',
    myRole: 'engineer',
    memberCount: 3,
    isArchived: false,
  },
  {
    id: 'p-tester',
    name: 'Handheld surface-charge tester',
    productLine: 'Field instruments',
    description: 'Two alkaline cells and a four-cell ladder.',
    myRole: 'lead',
    memberCount: 1,
    isArchived: false,
  },
];

describe('ProjectList', () => {
  it('lists each project with its product line, the user’s role and the member count', () => {
    renderWithApp(<ProjectList projects={projects} />);

    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(2);
    const ionizer = screen.getByRole('listitem', { name: 'Cleanroom ionizer bar' });
    expect(within(ionizer).getByText('Ionizers')).toBeInTheDocument();
    expect(within(ionizer).getByText('engineer')).toBeInTheDocument();
    expect(within(ionizer).getByText('3 members')).toBeInTheDocument();
    const tester = screen.getByRole('listitem', { name: 'Handheld surface-charge tester' });
    expect(within(tester).getByText('lead')).toBeInTheDocument();
    expect(within(tester).getByText('1 member')).toBeInTheDocument();
  });

  it('links each project name to that project’s page', async () => {
    const { router } = renderWithApp(<ProjectList projects={projects} />, {
      routes: [{ path: '/projects/:projectId', element: <p>project page</p> }],
    });
    const link = screen.getByRole('link', { name: 'Handheld surface-charge tester' });
    expect(link).toHaveAttribute('href', '/projects/p-tester');

    fireEvent.click(link);
    expect(await screen.findByText('project page')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/projects/p-tester');
  });

  it('says so when the user belongs to no project', () => {
    renderWithApp(<ProjectList projects={[]} />);
    expect(screen.getByText('No projects yet')).toBeInTheDocument();
    expect(screen.queryByRole('listitem')).not.toBeInTheDocument();
  });

  it('shows an admin without a project where the admin’s own pages are', () => {
    renderWithApp(<ProjectList projects={[]} accountRole="admin" />);
    expect(screen.getByText('No projects of yours')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Accounts' })).toHaveAttribute('href', '/admin/accounts');
    expect(screen.getByRole('link', { name: 'Audit log' })).toHaveAttribute('href', '/admin/audit-log');
    // The Outbox has its link in the header; a second one here would make two of that name on the page.
    expect(screen.queryByRole('link', { name: 'Outbox' })).not.toBeInTheDocument();
    expect(screen.queryByText(/A lead can add you/)).not.toBeInTheDocument();
  });
});
