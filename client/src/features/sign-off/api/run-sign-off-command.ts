import { useMutation } from '@tanstack/react-query';
import type { SignOff, SignOffNoteRequest } from '@ladderwright/shared/api';
import type { RevisionCommand } from '@ladderwright/shared/reviews';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { useApplySignOff } from '../hooks/use-apply-sign-off';

/** The commands a user sends with a note only (submit also names reviewers; supersede is the server's own). */
export type NoteCommand = Exclude<RevisionCommand, 'submit' | 'supersede'>;

export interface NoteCommandInput {
  command: NoteCommand;
  request: SignOffNoteRequest;
}

/**
 * POST .../withdraw, .../approve, .../return (note required) or .../release: the four share one request and
 * one answer (the new Sign-off), so one file serves them.
 */
export function runSignOffCommand(
  projectId: string,
  designId: string,
  revisionNumber: number,
  { command, request }: NoteCommandInput,
): Promise<SignOff> {
  return apiRequest<SignOff>(apiPaths.revisionAction(projectId, designId, revisionNumber, command), {
    method: 'POST',
    body: request,
  });
}

export function useRunSignOffCommand(projectId: string, designId: string, revisionNumber: number) {
  const applySignOff = useApplySignOff(projectId, designId, revisionNumber);
  return useMutation({
    mutationFn: (input: NoteCommandInput) => runSignOffCommand(projectId, designId, revisionNumber, input),
    onSuccess: applySignOff,
  });
}
