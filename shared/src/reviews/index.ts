export {
  REVISION_STATES,
  applyTransition,
  availableCommands,
  isRevisionState,
  transitionRefusal,
} from './revision-states';
export type { RevisionCommand, RevisionState, TransitionRequest } from './revision-states';
