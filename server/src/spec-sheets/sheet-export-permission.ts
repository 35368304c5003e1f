import { canInProject } from '@ladderwright/shared/auth';
import { DomainError } from '@ladderwright/shared/errors';
import type { ProjectMembership } from '../common/request.types';

/**
 * A released revision's sheet needs specSheet.export (lead); a sheet of any other state specSheet.exportDraft.
 * `sheet` names the sheet in the refusal ("spec sheet", "transformer sheet").
 */
export function assertMayExportSheet(membership: ProjectMembership, isReleased: boolean, sheet: string): void {
  const action = isReleased ? 'specSheet.export' : 'specSheet.exportDraft';
  if (canInProject(membership.role, action)) return;
  throw new DomainError(
    'forbidden',
    isReleased
      ? `Only a lead exports the ${sheet} of a released revision (you are ${membership.role})`
      : `Only an engineer or a lead exports a draft ${sheet} (you are ${membership.role})`,
  );
}
