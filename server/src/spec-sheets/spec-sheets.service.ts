import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { CurrentUser } from '@ladderwright/shared/api';
import { type DesignReport, headlineSource, ratedPoint } from '@ladderwright/shared/analysis';
import type { Design } from '@ladderwright/shared/designs';
import { type AcceptanceLimits, type AcceptanceSettings, acceptanceLimits } from '@ladderwright/shared/reviews';
import { toleranceSpread } from '@ladderwright/shared/sizing';
import { BenchRunsService } from '../bench-runs/bench-runs.service';
import { CalibrationsService } from '../calibrations/calibrations.service';
import type { ProjectMembership } from '../common/request.types';
import { assertMayExportSheet } from './sheet-export-permission';
import { ProjectModel } from '../projects/project.model';
import { ProjectsService } from '../projects/projects.service';
import { SignOffService } from '../reviews/sign-off.service';
import { CurrentSimulationService } from '../simulations/current-simulation.service';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import type { RevisionRef } from '../revisions/revision-ref.decorator';
import { fileStem } from '../revisions/revision-shapes';
import type * as PdfModule from './spec-sheet-pdf';
import type { SpecSheetContent, WindingSpec } from './spec-sheet.types';

/** The PDF writer (pdfkit and its fonts), loaded at the first sheet rather than at start-up. */
function loadPdf(): typeof PdfModule {
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- a lazy load; import() would need ESM here
  return require('./spec-sheet-pdf') as typeof PdfModule;
}

export interface SpecSheetFile {
  fileName: string;
  body: Buffer;
}

/**
 * The transformer data: from the driver stage and the stored report's driver checks (the authoritative
 * figures, computed with the ladder the driver feeds) when the design has one, else the secondary.
 */
function windingOf(content: Pick<SpecSheetContent, 'document' | 'report'>): WindingSpec {
  const { document, report } = content;
  const drive = report.resolvedDrive;
  const secondaryPeakV = drive.kind === 'sine' ? drive.peakV : Math.max(drive.forwardPeakV, drive.flybackPeakV);
  if (document.drive.kind === 'driver' && report.driver) {
    const hipot = report.driver.hipotTestVoltageV;
    const tx = document.drive.driver.transformer;
    return {
      kind: 'driver',
      primaryTurns: tx.primaryTurns,
      feedbackTurns: tx.feedbackTurns,
      secondaryTurns: tx.secondaryTurns,
      primaryInductanceH: tx.primaryInductanceH,
      couplingCoefficient: tx.couplingCoefficient,
      saturationCurrentA: tx.saturationCurrentA,
      insulationRatedV: tx.insulation?.ratedVoltageV ?? null,
      secondaryPeakV,
      frequencyHz: drive.frequencyHz,
      hipotTestV: hipot.value,
      hipotMethod: hipot.method.summary.split(',')[0] ?? 'see method',
    };
  }
  const waveform =
    drive.kind === 'sine'
      ? 'sine (peak stated, not rms)'
      : `pulses: forward ${drive.forwardPeakV.toFixed(0)} V, flyback ${drive.flybackPeakV.toFixed(0)} V peak, duty ${(drive.dutyCycle * 100).toFixed(0)} %`;
  return { kind: 'secondary', secondaryPeakV, frequencyHz: drive.frequencyHz, waveform };
}

/** Trials and seed of the tolerance spread behind the acceptance window (seeded, so the sheet is reproducible). */
export const ACCEPTANCE_SPREAD_TRIALS = 400;
const ACCEPTANCE_SPREAD_SEED = 20_260_101;

/**
 * The acceptance window: the output's spread over the capacitor tolerances the document states (seeded Monte
 * Carlo of the steady-state analysis), at the project's coverage, stretched to contain the target. The ladder is
 * driven as at the rated load (a driver design's operating point, where its headline output comes from), not at the
 * driver's limit.
 */
export function acceptanceOf(document: Design, report: DesignReport, settings: AcceptanceSettings): AcceptanceLimits {
  const spread = toleranceSpread({
    input: ratedPoint(document).input,
    capacitorTolerance: document.multiplier.capacitors.map((capacitor) => capacitor.tolerance),
    driveVariation: 0,
    trials: ACCEPTANCE_SPREAD_TRIALS,
    seed: ACCEPTANCE_SPREAD_SEED,
  });
  return acceptanceLimits({
    targetOutputV: document.targets.outputV,
    spreadMeanV: spread.outputV.mean,
    spreadSdV: spread.outputV.sd,
    ripplePeakToPeakV: report.ripplePeakToPeakV,
    rippleMaxV: document.targets.rippleMaxV,
    settings,
  });
}

/**
 * The supplier spec sheet of one revision, from its stored document and engine report and its Sign-off.
 * A released revision needs specSheet.export (lead); any other state specSheet.exportDraft and is marked
 * NOT RELEASED on every page.
 */
@Injectable()
export class SpecSheetsService {
  constructor(
    @InjectModel(ProjectModel) private readonly projects: typeof ProjectModel,
    private readonly projectsService: ProjectsService,
    private readonly lookup: RevisionLookupService,
    private readonly signOff: SignOffService,
    private readonly benchRuns: BenchRunsService,
    private readonly calibrations: CalibrationsService,
    private readonly currentSimulation: CurrentSimulationService,
  ) {}

  async render(input: {
    ref: RevisionRef;
    user: CurrentUser;
    membership: ProjectMembership;
    now: Date;
  }): Promise<SpecSheetFile> {
    const { ref, user, membership, now } = input;
    const { design, revision } = await this.lookup.find(ref);
    const isReleased = revision.state === 'released';
    assertMayExportSheet(membership, isReleased, 'spec sheet');
    const [signOff, project, settings, benchRuns, simulated, calibrations] = await Promise.all([
      this.signOff.get(ref, user, membership),
      this.projects.findByPk(ref.projectId),
      this.projectsService.settings(ref.projectId),
      this.benchRuns.listForRevisionWithPoints(revision.designId, revision.number),
      this.currentSimulation.find(revision.designId, revision.number, revision.document, revision.engineVersion),
      this.calibrations.listForRevision(revision.designId, revision.number),
    ]);
    const report = revision.report as unknown as DesignReport;
    const document = revision.document;
    const release = [...signOff.history].reverse().find((entry) => entry.command === 'release');
    const content: SpecSheetContent = {
      projectName: project?.name ?? '',
      designName: design.name,
      revisionNumber: revision.number,
      state: revision.state,
      isReleased,
      authorName: signOff.authorName,
      approvals: signOff.approvals,
      releasedBy: release ? { name: release.actorName ?? '', at: release.at } : null,
      generatedAt: now,
      engineVersion: revision.engineVersion,
      document,
      report,
      headline: headlineSource(report, simulated.simulation, document.targets),
      winding: windingOf({ document, report }),
      acceptance: acceptanceOf(document, report, settings.acceptance),
      overrides: signOff.overrides,
      benchRuns,
      calibrations: calibrations.filter((calibration) => calibration.status === 'succeeded'),
    };
    const suffix = isReleased ? '' : '-not-released';
    return {
      fileName: `${fileStem(design.name)}-r${revision.number}-spec-sheet${suffix}.pdf`,
      body: await loadPdf().renderSpecSheetPdf(content),
    };
  }
}
