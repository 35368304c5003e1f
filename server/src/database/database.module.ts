import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AuditEntryModel } from '../audit/audit-entry.model';
import { APP_ENV, type AppEnv } from '../config/env';
import { BenchRunEventModel } from '../bench-runs/bench-run-event.model';
import { BenchRunFileModel } from '../bench-runs/bench-run-file.model';
import { BenchRunModel } from '../bench-runs/bench-run.model';
import { DesignModel } from '../designs/design.model';
import { PartModel } from '../parts/part.model';
import { MemberRequestModel } from '../member-requests/member-request.model';
import { ProjectMemberModel } from '../projects/project-member.model';
import { ProjectModel } from '../projects/project.model';
import { SimulationJobModel } from '../simulations/simulation-job.model';
import { CalibrationModel } from '../calibrations/calibration.model';
import { RevisionModel } from '../revisions/revision.model';
import { CapturedMailModel } from '../mail/captured-mail.model';
import { MailQueueModel } from '../mail/mail-queue.model';
import { ReviewCommentModel } from '../reviews/review-comment.model';
import { RevisionReviewerModel } from '../reviews/revision-reviewer.model';
import { RevisionTransitionModel } from '../reviews/revision-transition.model';
import { PasswordResetLinkModel } from '../users/password-reset-link.model';
import { UserModel } from '../users/user.model';

export const ALL_MODELS = [
  MailQueueModel,
  CapturedMailModel,
  RevisionReviewerModel,
  RevisionTransitionModel,
  ReviewCommentModel,
  UserModel,
  PasswordResetLinkModel,
  ProjectModel,
  ProjectMemberModel,
  MemberRequestModel,
  DesignModel,
  RevisionModel,
  PartModel,
  BenchRunModel,
  BenchRunFileModel,
  BenchRunEventModel,
  AuditEntryModel,
  SimulationJobModel,
  CalibrationModel,
];

/**
 * The one Sequelize connection. Models are registered explicitly; the schema comes only from
 * migrations (no sync). The connection is lazy, so the app boots and reports `degraded` health
 * while the database is down.
 */
const WARM_CONNECTIONS = 4;

@Module({
  imports: [
    SequelizeModule.forRootAsync({
      inject: [APP_ENV],
      useFactory: (env: AppEnv) => ({
        dialect: 'postgres',
        uri: env.databaseUrl,
        models: ALL_MODELS,
        autoLoadModels: false,
        synchronize: false,
        logging: false,
        // A few connections stay open: opening one (a new PostgreSQL backend and its authentication) costs
        // far more than a query on a busy machine, and a burst would otherwise make a bystander wait for it.
        pool: {
          max: env.databasePoolMax,
          min: Math.min(env.databasePoolMax, WARM_CONNECTIONS),
          acquire: env.databaseAcquireTimeoutMs,
          idle: 10_000,
        },
        dialectOptions: { connectionTimeoutMillis: 5_000 },
      }),
    }),
  ],
})
export class DatabaseModule {}
