import { useMutation } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { apiBlobRequest } from '../../../lib/api-client';

/** The revision's Spec sheet (PDF); the server marks unreleased sheets NOT RELEASED and refuses roles (403). */
export function getSpecSheet(projectId: string, designId: string, revisionNumber: number): Promise<Blob> {
  return apiBlobRequest(apiPaths.revisionAction(projectId, designId, revisionNumber, 'spec-sheet.pdf'));
}

/** Downloads the Spec sheet and hands it to the browser as `fileName`. */
export function useDownloadSpecSheet(projectId: string, designId: string, revisionNumber: number, fileName: string) {
  return useMutation({
    mutationFn: () => getSpecSheet(projectId, designId, revisionNumber),
    onSuccess: (blob) => {
      const url = URL.createObjectURL(blob);
      const link = document.createElement('a');
      link.href = url;
      link.download = fileName;
      document.body.append(link);
      link.click();
      link.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
    },
  });
}
