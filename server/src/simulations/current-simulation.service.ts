import { isDeepStrictEqual } from 'node:util';
import { Injectable } from '@nestjs/common';
import type { CurrentSimulationResponse } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { SimulationJobModel } from './simulation-job.model';

/** Succeeded full runs of one revision looked at, newest first: older ones are superseded anyway. */
const CANDIDATES = 5;

/**
 * The stored full simulation that may stand for a revision's estimate: succeeded, of kind 'full', run on the same
 * document as the revision's and by the engine version of its report. A run of another engine version, of a
 * document that differs, or from before runs recorded their engine version, is not current.
 */
@Injectable()
export class CurrentSimulationService {
  async find(
    designId: string,
    revisionNumber: number,
    document: Design,
    engineVersion: string,
  ): Promise<CurrentSimulationResponse> {
    const jobs = await SimulationJobModel.findAll({
      where: { designId, revisionNumber, kind: 'full', status: 'succeeded' },
      order: [['finishedAt', 'DESC']],
      limit: CANDIDATES,
    });
    for (const job of jobs) {
      const summary = job.result?.summary;
      if (!summary || summary.engineVersion !== engineVersion) continue;
      if (!isDeepStrictEqual(job.input.document, document)) continue;
      return {
        jobId: job.id,
        simulation: {
          engineVersion: summary.engineVersion,
          outputMeanV: summary.outputMeanV,
          ripplePeakToPeakV: summary.ripplePeakToPeakV,
          dischargeTimeS: summary.dischargeTimeS,
          oscillationFrequencyHz: summary.oscillationFrequencyHz ?? null,
          isOscillationIrregular: summary.isOscillationIrregular ?? null,
          efficiency: summary.efficiency ?? null,
          notSettledWithinS: summary.notSettledWithinS ?? null,
          finishedAt: (job.finishedAt ?? job.updatedAt).toISOString(),
        },
      };
    }
    return { jobId: null, simulation: null };
  }
}
