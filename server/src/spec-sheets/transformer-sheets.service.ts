import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { CurrentUser } from '@ladderwright/shared/api';
import type { DesignReport } from '@ladderwright/shared/analysis';
import { DomainError } from '@ladderwright/shared/errors';
import type { ProjectMembership } from '../common/request.types';
import { assertMayExportSheet } from './sheet-export-permission';
import { ProjectModel } from '../projects/project.model';
import { SignOffService } from '../reviews/sign-off.service';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import type { RevisionRef } from '../revisions/revision-ref.decorator';
import { fileStem } from '../revisions/revision-shapes';
import type { SpecSheetFile } from './spec-sheets.service';
import type * as PdfModule from './transformer-sheet-pdf';
import type { TransformerSheetContent } from './transformer-sheet.types';

/** The PDF writer (pdfkit and its fonts), loaded at the first sheet rather than at start-up. */
function loadPdf(): typeof PdfModule {
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- a lazy load; import() would need ESM here
  return require('./transformer-sheet-pdf') as typeof PdfModule;
}

/**
 * The transformer sheet of one revision, for the magnetics supplier: from the stored document's transformer
 * section and the stored report's transformer figures, with the revision's Sign-off. The same permissions as the
 * supply's spec sheet: a released revision needs specSheet.export (lead); any other state specSheet.exportDraft
 * and is marked NOT RELEASED on every page.
 */
@Injectable()
export class TransformerSheetsService {
  constructor(
    @InjectModel(ProjectModel) private readonly projects: typeof ProjectModel,
    private readonly lookup: RevisionLookupService,
    private readonly signOff: SignOffService,
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
    assertMayExportSheet(membership, isReleased, 'transformer sheet');
    const document = revision.document;
    const report = revision.report as unknown as DesignReport;
    const driver = document.drive.kind === 'driver' ? document.drive.driver : null;
    const section = driver?.transformerChoice === 'designed' ? driver.transformerDesign : undefined;
    if (!section || !report.transformer || !report.driver) {
      throw new DomainError(
        'not_found',
        section
          ? `Revision ${revision.number} was computed before its transformer section was; save a new revision to get its transformer sheet`
          : `Revision ${revision.number} gives its transformer as numbers; design it from a core in the Transformer section to get a transformer sheet`,
        'transformerDesign',
      );
    }
    const [signOff, project] = await Promise.all([
      this.signOff.get(ref, user, membership),
      this.projects.findByPk(ref.projectId),
    ]);
    const release = [...signOff.history].reverse().find((entry) => entry.command === 'release');
    const figures = report.driver.figures;
    const content: TransformerSheetContent = {
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
      section,
      report: report.transformer,
      frequencyHz: figures.frequencyHz.value,
      secondaryWorkingPeakV: Math.max(
        Math.abs(figures.forwardSecondaryPeakV.value),
        Math.abs(report.driver.operatingPoint.ratedLoad.flybackSecondaryPeakV),
      ),
    };
    const suffix = isReleased ? '' : '-not-released';
    return {
      fileName: `${fileStem(design.name)}-r${revision.number}-transformer-sheet${suffix}.pdf`,
      body: await loadPdf().renderTransformerSheetPdf(content),
    };
  }
}
