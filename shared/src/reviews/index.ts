export {
  REVISION_STATES,
  applyTransition,
  availableCommands,
  isRevisionState,
  transitionRefusal,
} from './revision-states';
export type { RevisionCommand, RevisionState, TransitionRequest } from './revision-states';
export {
  ACCEPTANCE_COVERAGES,
  BENCH_ALLOWANCE_MAX,
  COVERAGE_FACTORS,
  DEFAULT_ACCEPTANCE_SETTINGS,
  acceptanceLimits,
  isAcceptanceCoverage,
} from './acceptance-limits';
export type { AcceptanceCoverage, AcceptanceInput, AcceptanceLimits, AcceptanceSettings } from './acceptance-limits';
export {
  GATED_COMMANDS,
  OVERRIDE_REASON_MIN_LENGTH,
  gateReasons,
  isGatedCommand,
  overrideReasonProblem,
} from './sign-off-gates';
export type { GateInput, GateReason, GatedCommand } from './sign-off-gates';
