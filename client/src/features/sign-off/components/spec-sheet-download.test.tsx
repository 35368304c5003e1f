import { fireEvent, screen } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { SpecSheetDownload, type SpecSheetDownloadProps } from './spec-sheet-download';

const props: SpecSheetDownloadProps = {
  projectId: 'p-1',
  designId: 'd-1',
  designName: 'Bias supply',
  revisionNumber: 2,
  state: 'released',
  projectRole: 'lead',
};

describe('SpecSheetDownload', () => {
  beforeEach(() => vi.stubGlobal('fetch', vi.fn<typeof fetch>()));

  it('offers a released sheet to a lead and an unreleased one to an engineer, marked NOT RELEASED', () => {
    const { unmount } = renderWithApp(<SpecSheetDownload {...props} />);
    expect(screen.getByRole('button', { name: 'Download Spec sheet (PDF)' })).toBeInTheDocument();
    unmount();

    renderWithApp(<SpecSheetDownload {...props} state="draft" projectRole="engineer" />);
    expect(screen.getByRole('button', { name: 'Download Spec sheet (PDF, NOT RELEASED)' })).toBeInTheDocument();
    expect(screen.getByText(/every page of its sheet is marked NOT RELEASED/)).toBeInTheDocument();
  });

  it('offers no download to an engineer on a released revision or to a reviewer on a draft', () => {
    const { unmount } = renderWithApp(<SpecSheetDownload {...props} projectRole="engineer" />);
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    expect(screen.getByText('Leads download released Spec sheets.')).toBeInTheDocument();
    unmount();

    renderWithApp(<SpecSheetDownload {...props} state="approved" projectRole="reviewer" />);
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    expect(screen.getByText('Engineers and leads download unreleased Spec sheets.')).toBeInTheDocument();
  });

  it('shows the refusal when the server answers 403', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async () =>
        jsonResponse({ statusCode: 403, code: 'forbidden', message: 'Only a lead may export a released sheet.' }, 403),
      ),
    );
    renderWithApp(<SpecSheetDownload {...props} />);
    fireEvent.click(screen.getByRole('button', { name: 'Download Spec sheet (PDF)' }));
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Not permitted for your role');
    expect(alert).toHaveTextContent('Only a lead may export a released sheet. (HTTP 403)');
  });

  it('asks the server for the Transformer sheet of a designed transformer', async () => {
    const fetchMock = vi.fn<typeof fetch>(async () => new Response(new Blob(['%PDF']), { status: 200 }));
    vi.stubGlobal('fetch', fetchMock);
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: () => 'blob:sheet', revokeObjectURL: () => undefined }));
    renderWithApp(<SpecSheetDownload {...props} state="draft" projectRole="engineer" sheet="transformer" />);
    fireEvent.click(screen.getByRole('button', { name: 'Download Transformer sheet (PDF, NOT RELEASED)' }));
    await vi.waitFor(() => expect(fetchMock).toHaveBeenCalled());
    expect(String(fetchMock.mock.calls[0]?.[0])).toContain('/revisions/2/transformer-sheet.pdf');
  });
});
