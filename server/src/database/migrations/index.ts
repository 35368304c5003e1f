import type { SchemaMigration } from './migration.types';
import { usersAndProjects } from './0001-users-and-projects';
import { designsAndRevisions } from './0002-designs-and-revisions';
import { partsAndBenchRuns } from './0005-parts-and-bench-runs';
import { auditLog } from './0006-audit-log';
import { simulationJobs } from './0003-simulation-jobs';
import { signOffAndMail } from './0004-sign-off-and-mail';
import { teamAdministration } from './0007-team-administration';
import { sessionsAndSignInLimits } from './0008-sessions-and-sign-in-limits';
import { simulationJobHeartbeat } from './0009-simulation-job-heartbeat';
import { driverSecondaryPhasing } from './0010-driver-secondary-phasing';
import { magneticsParts } from './0011-magnetics-parts';
import { calibrations } from './0012-calibrations';
import { memberRequests } from './0013-member-requests';
import { simulationBatches } from './0014-simulation-batches';
import { calibrationEvaluations } from './0015-calibration-evaluations';
import { trappedChargeServiceCondition } from './0016-trapped-charge-service-condition';
import { rcdClampLevel } from './0017-rcd-clamp-level';
import { modelRunHeartbeat } from './0018-model-run-heartbeat';

/** Every schema step in order. Add new steps at the end. */
export const SCHEMA_MIGRATIONS: readonly SchemaMigration[] = [
  usersAndProjects,
  designsAndRevisions,
  partsAndBenchRuns,
  auditLog,
  simulationJobs,
  signOffAndMail,
  teamAdministration,
  sessionsAndSignInLimits,
  simulationJobHeartbeat,
  driverSecondaryPhasing,
  magneticsParts,
  calibrations,
  memberRequests,
  simulationBatches,
  calibrationEvaluations,
  trappedChargeServiceCondition,
  rcdClampLevel,
  modelRunHeartbeat,
];
