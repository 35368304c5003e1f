import { screen } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { RevisionSummary } from '@ladderwright/shared/api';
import { renderWithApp } from '../../../testing/render';
import { RevisionHistory } from './revision-history';

const revision = (number: number): RevisionSummary => ({
  number,
  state: 'draft',
  authorId: 'u-eng',
  authorName: 'Northfold Engineer',
  createdAt: '2025-03-04T10:00:00.000Z',
  changeNote: `Change ${number}`,
  baseRevisionNumber: number > 1 ? number - 1 : null,
  engineVersion: '1.4.0',
});

describe('RevisionHistory', () => {
  beforeEach(() => {
    // Two revisions ask the server for their comparison; this test reads only the controls.
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(() => new Promise<Response>(() => {})),
    );
  });

  it('offers no pair to compare with one revision, only another design', () => {
    renderWithApp(<RevisionHistory projectId="p-1" designId="d-1" revisions={[revision(1)]} openRevisionNumber={1} />);
    expect(screen.queryByRole('combobox', { name: 'Revision A' })).not.toBeInTheDocument();
    expect(screen.getByText(/One revision so far/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Compare with a revision of another design/ })).toBeInTheDocument();
  });

  it('offers the two newest revisions to compare once there are two', () => {
    renderWithApp(
      <RevisionHistory projectId="p-1" designId="d-1" revisions={[revision(1), revision(2)]} openRevisionNumber={2} />,
    );
    expect(screen.getByRole('combobox', { name: 'Revision A' })).toHaveValue('r1 · Change 1');
    expect(screen.getByRole('combobox', { name: 'Revision B' })).toHaveValue('r2 · Change 2');
    expect(screen.queryByText(/One revision so far/)).not.toBeInTheDocument();
  });
});
