export {
  REVISION_STATES,
  applyTransition,
  availableCommands,
  isRevisionState,
  transitionRefusal,
} from './revision-states';
export type { RevisionCommand, RevisionState, TransitionRequest } from './revision-states';
export { OUTPUT_ACCEPTANCE_BAND, acceptanceLimits } from './acceptance-limits';
export type { AcceptanceInput, AcceptanceLimits } from './acceptance-limits';
