import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { CurrentUser } from '@ladderwright/shared/api';
import { canInProject } from '@ladderwright/shared/auth';
import { runDriverChecks } from '@ladderwright/shared/driver';
import { DomainError } from '@ladderwright/shared/errors';
import type { DesignReport } from '@ladderwright/shared/analysis';
import { acceptanceLimits } from '@ladderwright/shared/reviews';
import { BenchRunsService } from '../bench-runs/bench-runs.service';
import type { ProjectMembership } from '../common/request.types';
import { ProjectModel } from '../projects/project.model';
import { SignOffService } from '../reviews/sign-off.service';
import { fileStem } from '../revisions/revision-shapes';
import { renderSpecSheetPdf } from './spec-sheet-pdf';
import type { SpecSheetContent, WindingSpec } from './spec-sheet.types';

export interface SpecSheetFile {
  fileName: string;
  body: Buffer;
}

/** The transformer data: from the driver stage and its checks when the design has one, else the secondary. */
function windingOf(content: Pick<SpecSheetContent, 'document' | 'report'>): WindingSpec {
  const { document, report } = content;
  const drive = report.resolvedDrive;
  const secondaryPeakV = drive.kind === 'sine' ? drive.peakV : Math.max(drive.forwardPeakV, drive.flybackPeakV);
  if (document.drive.kind === 'driver') {
    const driver = document.drive.driver;
    const checks = runDriverChecks(driver);
    const tx = driver.transformer;
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
      hipotTestV: checks.hipotTestVoltageV.value,
      hipotMethod: checks.hipotTestVoltageV.method.summary.split(',')[0] ?? 'see method',
    };
  }
  const waveform =
    drive.kind === 'sine'
      ? 'sine (peak stated, not rms)'
      : `pulses: forward ${drive.forwardPeakV.toFixed(0)} V, flyback ${drive.flybackPeakV.toFixed(0)} V peak, duty ${(drive.dutyCycle * 100).toFixed(0)} %`;
  return { kind: 'secondary', secondaryPeakV, frequencyHz: drive.frequencyHz, waveform };
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
    private readonly signOff: SignOffService,
    private readonly benchRuns: BenchRunsService,
  ) {}

  async render(
    projectId: string,
    designId: string,
    rawNumber: string,
    user: CurrentUser,
    membership: ProjectMembership,
    now: Date,
  ): Promise<SpecSheetFile> {
    const { design, revision } = await this.signOff.load(projectId, designId, rawNumber);
    const isReleased = revision.state === 'released';
    const action = isReleased ? 'specSheet.export' : 'specSheet.exportDraft';
    if (!canInProject(membership.role, action)) {
      throw new DomainError(
        'forbidden',
        isReleased
          ? `Only a lead exports the spec sheet of a released revision (you are ${membership.role})`
          : `Only an engineer or a lead exports a draft spec sheet (you are ${membership.role})`,
      );
    }
    const [signOff, project, benchRuns] = await Promise.all([
      this.signOff.get(projectId, designId, rawNumber, user, membership),
      this.projects.findByPk(projectId),
      this.benchRuns.listForRevisionWithPoints(revision.designId, revision.number),
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
      winding: windingOf({ document, report }),
      acceptance: acceptanceLimits({
        outputMeanV: report.outputMeanV,
        ripplePeakToPeakV: report.ripplePeakToPeakV,
        rippleMaxV: document.targets.rippleMaxV,
        targetOutputV: document.targets.outputV,
      }),
      benchRuns,
    };
    const suffix = isReleased ? '' : '-not-released';
    return {
      fileName: `${fileStem(design.name)}-r${revision.number}-spec-sheet${suffix}.pdf`,
      body: await renderSpecSheetPdf(content),
    };
  }
}
