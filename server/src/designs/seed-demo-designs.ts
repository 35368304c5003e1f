import type { Sequelize, Transaction } from 'sequelize';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import type { RevisionCommand, RevisionState } from '@ladderwright/shared/reviews';
import { AnalysisService } from '../analysis/analysis.service';
import { runEngineTask } from '../analysis/engine.worker';
import { PartModel } from '../parts/part.model';
import { toPart } from '../parts/parts.service';
import { ProjectModel } from '../projects/project.model';
import { RevisionReviewerModel } from '../reviews/revision-reviewer.model';
import { RevisionTransitionModel } from '../reviews/revision-transition.model';
import { RevisionModel } from '../revisions/revision.model';
import { UserModel } from '../users/user.model';
import { DesignModel } from './design.model';

interface DemoRevision {
  document: Design;
  state: RevisionState;
  changeNote: string;
  /** The reviewer's note on the last Sign-off step (returned or approved). */
  reviewNote?: string;
}

/** Who takes a demo Sign-off step: the design's owner, the demo reviewer or the demo lead. */
type DemoActor = 'owner' | 'reviewer' | 'lead';

/**
 * The Sign-off steps that bring a demo revision from draft to its state, so that its Sign-off page shows who
 * submitted, returned, approved or released it, and the reviewer it was submitted to can act on it.
 */
const DEMO_SIGN_OFF_STEPS: Partial<Record<RevisionState, readonly [RevisionCommand, RevisionState, DemoActor][]>> = {
  submitted: [['submit', 'submitted', 'owner']],
  returned: [
    ['submit', 'submitted', 'owner'],
    ['return', 'returned', 'reviewer'],
  ],
  approved: [
    ['submit', 'submitted', 'owner'],
    ['approve', 'approved', 'reviewer'],
  ],
  released: [
    ['submit', 'submitted', 'owner'],
    ['approve', 'approved', 'reviewer'],
    ['release', 'released', 'lead'],
  ],
};

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
        reviewNote: 'Droop at 30 µA is too close to the limit with 1 nF stages',
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
    revisions: [
      {
        document: designExamples.precipitatorCell,
        state: 'released',
        changeNote: 'Created',
        reviewNote: 'Spacing and ratings checked',
      },
    ],
  },
  {
    projectName: 'Handheld surface-charge tester',
    ownerEmail: 'field-engineer@northfold.test',
    revisions: [
      {
        document: designExamples.surfaceChargeTester,
        state: 'approved',
        changeNote: 'Created',
        reviewNote: 'Battery life fits a working week',
      },
    ],
  },
];

/** How many records DEMO_DESIGNS adds to an empty database: each design and each of its revisions. */
export const DEMO_DESIGN_RECORD_COUNT = DEMO_DESIGNS.reduce((sum, design) => sum + 1 + design.revisions.length, 0);

/**
 * Adds the demo designs that are missing (matched by project and design name), each with its revisions,
 * reports computed by the shared engine against the project's Parts shelf and the Sign-off steps of its state, in one
 * transaction per design. Needs the demo accounts and projects (and their shelves, seeded first). Returns how many
 * designs and revisions it created.
 */
export async function seedDemoDesigns(sequelize: Sequelize): Promise<number> {
  // Trusted demo data at start-up: the engine runs on this thread.
  const analysis = new AnalysisService({ run: (task) => Promise.resolve(runEngineTask(task)) });
  let created = 0;
  for (const demo of DEMO_DESIGNS) {
    const latest = demo.revisions[demo.revisions.length - 1];
    if (!latest) continue;
    const [project, owner, reviewer, lead] = await Promise.all([
      ProjectModel.findOne({ where: { name: demo.projectName } }),
      UserModel.findOne({ where: { email: demo.ownerEmail } }),
      UserModel.findOne({ where: { email: DEMO_REVIEWER_EMAIL } }),
      UserModel.findOne({ where: { email: DEMO_LEAD_EMAIL } }),
    ]);
    if (!project || !owner || !reviewer || !lead) {
      throw new Error(`demo design needs project '${demo.projectName}', ${demo.ownerEmail}, the reviewer and the lead`);
    }
    const actors: Record<DemoActor, string> = { owner: owner.id, reviewer: reviewer.id, lead: lead.id };
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
        const stored = await RevisionModel.create(
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
        await seedSignOffSteps(stored.id, revision, actors, transaction);
      }
    });
    created += 1 + demo.revisions.length;
  }
  return created;
}

/** The demo reviewer and lead, who take the Sign-off steps of the demo revisions (NAMING.md scenario). */
const DEMO_REVIEWER_EMAIL = 'reviewer@northfold.test';
const DEMO_LEAD_EMAIL = 'lead@northfold.test';

/** Records the steps that brought `revision` to its state, submitted to the demo reviewer, a second apart. */
async function seedSignOffSteps(
  revisionId: string,
  revision: DemoRevision,
  actors: Record<DemoActor, string>,
  transaction: Transaction,
): Promise<void> {
  const steps = DEMO_SIGN_OFF_STEPS[revision.state] ?? [];
  if (steps.length === 0) return;
  await RevisionReviewerModel.create({ revisionId, userId: actors.reviewer }, { transaction });
  const startMs = Date.now() - steps.length * 1000;
  const lastReviewerStep = steps.map(([, , actor]) => actor).lastIndexOf('reviewer');
  let fromState: RevisionState = 'draft';
  for (const [index, [command, toState, actor]] of steps.entries()) {
    const step = RevisionTransitionModel.build({
      revisionId,
      command,
      fromState,
      toState,
      actorId: actors[actor],
      note: index === lastReviewerStep ? (revision.reviewNote ?? '') : '',
    });
    // A second apart, so the history reads in order.
    step.createdAt = new Date(startMs + index * 1000);
    await step.save({ transaction });
    fromState = toState;
  }
}
