import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { SimulationJobModel } from './simulation-job.model';

/**
 * Ends a batch when its last member ends, on whichever instance ran (or cancelled, or found abandoned) that member.
 * The batch row is locked while its members are counted, so two members ending at once on two instances end it
 * once; a batch that is no longer running (cancelled) is left as it is.
 */
@Injectable()
export class SimulationBatchEndsService {
  constructor(private readonly sequelize: Sequelize) {}

  /** Moves the batch's progress on, or ends it: succeeded when any member succeeded, else failed. */
  async memberEnded(batchId: string): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      const batch = await SimulationJobModel.findByPk(batchId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!batch || batch.kind !== 'batch' || batch.status !== 'running') return;
      const [counts] = await this.sequelize.query<{ total: number; open: number; succeeded: number }>(
        `SELECT count(*)::int AS total,
                count(*) FILTER (WHERE status IN ('queued', 'running'))::int AS open,
                count(*) FILTER (WHERE status = 'succeeded')::int AS succeeded
         FROM simulation_jobs WHERE parent_job_id = :batchId`,
        { replacements: { batchId }, type: QueryTypes.SELECT, transaction },
      );
      const total = counts?.total ?? 0;
      const open = counts?.open ?? 0;
      if (open > 0) {
        const progressPct = Math.floor((100 * (total - open)) / Math.max(1, total));
        await batch.update({ progressPct }, { transaction });
        return;
      }
      const isSucceeded = (counts?.succeeded ?? 0) > 0;
      await batch.update(
        {
          status: isSucceeded ? 'succeeded' : 'failed',
          progressPct: 100,
          finishedAt: new Date(),
          ...(isSucceeded
            ? {}
            : { errorCode: 'members_failed', errorMessage: 'No member of the batch succeeded; see each member' }),
        },
        { transaction },
      );
    });
  }
}
