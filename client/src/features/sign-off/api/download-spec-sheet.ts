import { useMutation } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { apiBlobRequest } from '../../../lib/api-client';

/** Which supplier document: the supply's Spec sheet or the Transformer sheet of a designed transformer. */
export type SheetKind = 'supply' | 'transformer';

const SHEET_FILES: Record<SheetKind, string> = {
  supply: 'spec-sheet.pdf',
  transformer: 'transformer-sheet.pdf',
};

/** The revision's Spec sheet or Transformer sheet (PDF); the server marks unreleased sheets NOT RELEASED and refuses roles (403). */
export function getSpecSheet(
  projectId: string,
  designId: string,
  revisionNumber: number,
  sheet: SheetKind = 'supply',
): Promise<Blob> {
  return apiBlobRequest(apiPaths.revisionAction(projectId, designId, revisionNumber, SHEET_FILES[sheet]));
}

/** Downloads the sheet and hands it to the browser as `fileName`. */
export function useDownloadSpecSheet(
  projectId: string,
  designId: string,
  revisionNumber: number,
  fileName: string,
  sheet: SheetKind = 'supply',
) {
  return useMutation({
    mutationFn: () => getSpecSheet(projectId, designId, revisionNumber, sheet),
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
