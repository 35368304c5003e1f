import type { Sequelize } from 'sequelize';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import type { RevisionState } from '@ladderwright/shared/reviews';
import { AnalysisService } from '../analysis/analysis.service';
import { runEngineTask } from '../analysis/engine.worker';
import { PartModel } from '../parts/part.model';
import { toPart } from '../parts/parts.service';
import { ProjectModel } from '../projects/project.model';
import { RevisionModel } from '../revisions/revision.model';
import { UserModel } from '../users/user.model';
import { DesignModel } from './design.model';

interface DemoRevision {
  document: Design;
  state: RevisionState;
  changeNote: string;
}

interface DemoDesign {
  projectName: string;
  ownerEmail: string;
  revisions: DemoRevision[];
}

function withCapacitorsF(design: Design, valueF: number): Design {
  const copy = structuredClone(design);
  copy.multiplier.capacitors = copy.multiplier.capacitors.map((capacitor) => ({ ...capacitor, valueF }));
  return copy;
}

/** One demo design per demo project (NAMING.md scenario), in different Sign-off states. */
export const DEMO_DESIGNS: readonly DemoDesign[] = [
  {
    projectName: 'Cleanroom ionizer bar',
    ownerEmail: 'engineer@northfold.test',
    revisions: [
      {
        document: withCapacitorsF(designExamples.ionizerBar, 1e-9),
        state: 'returned',
        changeNote: 'First cut with 1 nF stages',
      },
      {
        document: designExamples.ionizerBar,
        state: 'draft',
        changeNote: 'Stages raised to 2.2 nF for less droop at 30 µA',
      },
    ],
  },
  {
    projectName: 'Detector tube bias',
    ownerEmail: 'engineer@northfold.test',
    revisions: [{ document: designExamples.detectorBias, state: 'submitted', changeNote: 'Created' }],
  },
  {
    projectName: 'Range-hood precipitator cell',
    ownerEmail: 'engineer@northfold.test',
    revisions: [{ document: designExamples.precipitatorCell, state: 'released', changeNote: 'Created' }],
  },
  {
    projectName: 'Handheld surface-charge tester',
    ownerEmail: 'field-engineer@northfold.test',
    revisions: [{ document: designExamples.surfaceChargeTester, state: 'approved', changeNote: 'Created' }],
  },
];

/** How many records DEMO_DESIGNS adds to an empty database: each design and each of its revisions. */
export const DEMO_DESIGN_RECORD_COUNT = DEMO_DESIGNS.reduce((sum, design) => sum + 1 + design.revisions.length, 0);

/**
 * Adds the demo designs that are missing (matched by project and design name), each with its revisions,
 * reports computed by the shared engine against the project's Parts shelf, in one transaction per design.
 * Needs the demo accounts and projects (and their shelves, seeded first). Returns how many records it created.
 */
export async function seedDemoDesigns(sequelize: Sequelize): Promise<number> {
  // Trusted demo data at start-up: the engine runs on this thread.
  const analysis = new AnalysisService({ run: (task) => Promise.resolve(runEngineTask(task)) });
  let created = 0;
  for (const demo of DEMO_DESIGNS) {
    const latest = demo.revisions[demo.revisions.length - 1];
    if (!latest) continue;
    const [project, owner] = await Promise.all([
      ProjectModel.findOne({ where: { name: demo.projectName } }),
      UserModel.findOne({ where: { email: demo.ownerEmail } }),
    ]);
    if (!project || !owner) throw new Error(`demo design needs project '${demo.projectName}' and ${demo.ownerEmail}`);
    const name = latest.document.name;
    if (await DesignModel.findOne({ where: { projectId: project.id, name } })) continue;
    const shelf = (await PartModel.findAll({ where: { projectId: project.id } })).map(toPart);
    await sequelize.transaction(async (transaction) => {
      const design = await DesignModel.create(
        { projectId: project.id, name, ownerId: owner.id, latestRevisionNumber: demo.revisions.length },
        { transaction },
      );
      for (const [index, revision] of demo.revisions.entries()) {
        const { engineVersion, report } = await analysis.evaluate(revision.document, 'document', shelf);
        await RevisionModel.create(
          {
            designId: design.id,
            number: index + 1,
            state: revision.state,
            document: revision.document,
            report,
            engineVersion,
            authorId: owner.id,
            changeNote: revision.changeNote,
            baseRevisionNumber: index === 0 ? null : index,
          },
          { transaction },
        );
      }
    });
    created += 1 + demo.revisions.length;
  }
  return created;
}
