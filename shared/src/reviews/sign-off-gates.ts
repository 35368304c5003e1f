import type { RevisionCommand } from './revision-states';

/** The commands a failing gate holds back (withdraw and return never are: they move a revision back). */
export const GATED_COMMANDS = ['submit', 'approve', 'release'] as const;
export type GatedCommand = (typeof GATED_COMMANDS)[number];

/** An override's reason must say why in at least this many characters (a recorded decision, not a click). */
export const OVERRIDE_REASON_MIN_LENGTH = 20;

/** Why a gated command is held back; each reason names what to fix. */
export type GateReason =
  | { code: 'failing_checks'; message: string; checkIds: string[] }
  | { code: 'open_threads'; message: string; threadCount: number }
  | { code: 'stale_results'; message: string; engineVersion: string; currentEngineVersion: string };

export interface GateInput {
  /** The stored report's Checks (id, subject, verdict). */
  checks: readonly { id: string; subject: string; verdict: 'pass' | 'marginal' | 'fail' }[];
  /** Comment threads on the revision that are not resolved. */
  openThreadCount: number;
  /** The engine version the revision's stored results were computed with. */
  engineVersion: string;
  /** The engine version of this server. */
  currentEngineVersion: string;
}

export function isGatedCommand(command: RevisionCommand): command is GatedCommand {
  return (GATED_COMMANDS as readonly string[]).includes(command);
}

/**
 * The reasons submit, approve and release are held back for a revision: any Check failing (marginal does not
 * hold back), any open comment thread, or results from another engine version than the server's. Empty when
 * the gates are clear.
 */
export function gateReasons(input: GateInput): GateReason[] {
  const reasons: GateReason[] = [];
  const failing = input.checks.filter((check) => check.verdict === 'fail');
  if (failing.length > 0) {
    const names = failing.map((check) => `${check.id} (${check.subject})`).join(', ');
    reasons.push({
      code: 'failing_checks',
      message: `${failing.length} Check${failing.length === 1 ? '' : 's'} fail${failing.length === 1 ? 's' : ''}: ${names}`,
      checkIds: failing.map((check) => check.id),
    });
  }
  if (input.openThreadCount > 0) {
    reasons.push({
      code: 'open_threads',
      message: `${input.openThreadCount} comment thread${input.openThreadCount === 1 ? ' is' : 's are'} still open`,
      threadCount: input.openThreadCount,
    });
  }
  if (input.engineVersion !== input.currentEngineVersion) {
    reasons.push({
      code: 'stale_results',
      message: `The stored results are from engine ${input.engineVersion}; this server runs ${input.currentEngineVersion}. Save the revision again to recompute them.`,
      engineVersion: input.engineVersion,
      currentEngineVersion: input.currentEngineVersion,
    });
  }
  return reasons;
}

/** What is wrong with an override reason, or null when it is acceptable. */
export function overrideReasonProblem(reason: string): string | null {
  const length = [...reason.trim()].length;
  return length < OVERRIDE_REASON_MIN_LENGTH
    ? `override.reason must be at least ${OVERRIDE_REASON_MIN_LENGTH} characters (it has ${length})`
    : null;
}
