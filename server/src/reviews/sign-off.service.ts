import { Inject, Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { CurrentUser, OverrideRequest, SignOff, SignOffOverride, SignOffPerson } from '@ladderwright/shared/api';
import type { ProjectRole } from '@ladderwright/shared/auth';
import { DomainError } from '@ladderwright/shared/errors';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import {
  applyTransition,
  availableCommands,
  type GateReason,
  gateReasons,
  isGatedCommand,
  overrideReasonProblem,
  type RevisionCommand,
} from '@ladderwright/shared/reviews';
import type { ProjectMembership } from '../common/request.types';
import { AuditService } from '../audit/audit.service';
import { APP_ENV, type AppEnv } from '../config/env';
import type { DesignModel } from '../designs/design.model';
import { MailService, type OutgoingMail } from '../mail/mail.service';
import { ProjectMemberModel } from '../projects/project-member.model';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import type { RevisionRef } from '../revisions/revision-ref.decorator';
import { RevisionModel } from '../revisions/revision.model';
import { UserModel } from '../users/user.model';
import { GatesClosedException } from './gates-closed.filter';
import { ReviewCommentModel } from './review-comment.model';
import { RevisionReviewerModel } from './revision-reviewer.model';
import { RevisionTransitionModel } from './revision-transition.model';
import { type MailSubject, transitionMail } from './sign-off-mail';

export type UserCommand = Exclude<RevisionCommand, 'supersede'>;

/** One Sign-off command as a route sends it. */
export interface TransitionInput {
  command: UserCommand;
  ref: RevisionRef;
  user: CurrentUser;
  membership: ProjectMembership;
  note?: string;
  reviewerIds?: string[];
  override?: OverrideRequest;
}

function personOf(member: ProjectMemberModel): SignOffPerson {
  const user = member.user;
  if (!user) throw new Error('member loaded without its user');
  return { userId: user.id, displayName: user.displayName, email: user.email, projectRole: member.role };
}

const DECIDING_ROLES: readonly ProjectRole[] = ['reviewer', 'lead'];

/**
 * The Sign-off of a revision: its state moves only through `applyTransition` (shared/src/reviews); each move
 * runs in one transaction with its audit entry and its notification mail, under the design row lock.
 */
@Injectable()
export class SignOffService {
  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    @InjectModel(RevisionModel) private readonly revisions: typeof RevisionModel,
    @InjectModel(RevisionReviewerModel) private readonly reviewers: typeof RevisionReviewerModel,
    @InjectModel(RevisionTransitionModel) private readonly transitions: typeof RevisionTransitionModel,
    @InjectModel(ProjectMemberModel) private readonly members: typeof ProjectMemberModel,
    @InjectModel(ReviewCommentModel) private readonly comments: typeof ReviewCommentModel,
    private readonly lookup: RevisionLookupService,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly sequelize: Sequelize,
  ) {}

  mailSubject(projectId: string, design: DesignModel, revisionNumber: number): MailSubject {
    const url = `${this.env.publicUrl}/projects/${projectId}/designs/${design.id}/revisions/${revisionNumber}/sign-off`;
    return { designName: design.name, revisionNumber, url };
  }

  /** What holds back submit, approve and release of `revision` now (its Checks, open threads, engine version). */
  async gateReasonsOf(revision: RevisionModel, transaction?: Transaction): Promise<GateReason[]> {
    const openThreadCount = await this.comments.count({
      where: { revisionId: revision.id, parentId: null, resolvedAt: null },
      transaction,
    });
    return gateReasons({
      checks: revision.report.checks,
      openThreadCount,
      engineVersion: revision.engineVersion,
      currentEngineVersion: ENGINE_VERSION,
    });
  }

  async get(ref: RevisionRef, user: CurrentUser, membership: ProjectMembership): Promise<SignOff> {
    const { projectId } = ref;
    const { design, revision } = await this.lookup.find(ref);
    const [assigned, members, history, reasons] = await Promise.all([
      this.reviewers.findAll({ where: { revisionId: revision.id } }),
      this.members.findAll({ where: { projectId }, include: [UserModel] }),
      this.transitions.findAll({
        where: { revisionId: revision.id },
        include: [UserModel],
        order: [['createdAt', 'ASC']],
      }),
      this.gateReasonsOf(revision),
    ]);
    const assignedIds = new Set(assigned.map((row) => row.userId));
    const isAuthor = revision.authorId === user.id;
    const mayDecide = membership.role === 'lead' || assignedIds.has(user.id);
    // An archived project takes no Sign-off command (the project guard refuses them).
    const commands = membership.isArchived
      ? []
      : availableCommands(revision.state, membership.role, isAuthor).filter(
          (command) => mayDecide || (command !== 'approve' && command !== 'return'),
        );
    const author = revision.author;
    return {
      projectId,
      designId: design.id,
      designName: design.name,
      revisionNumber: revision.number,
      state: revision.state,
      authorId: revision.authorId,
      authorName: author?.displayName ?? '',
      reviewers: members.filter((member) => assignedIds.has(member.userId)).map(personOf),
      candidateReviewers: members
        .filter((member) => DECIDING_ROLES.includes(member.role) && member.userId !== revision.authorId)
        .map(personOf),
      availableCommands: commands,
      approvals: history
        .filter((entry) => entry.command === 'approve')
        .map((entry) => ({
          userId: entry.actorId ?? '',
          displayName: entry.actor?.displayName ?? '',
          note: entry.note,
          at: entry.createdAt.toISOString(),
        })),
      history: history.map((entry) => ({
        id: entry.id,
        command: entry.command,
        fromState: entry.fromState,
        toState: entry.toState,
        actorId: entry.actorId,
        actorName: entry.actor?.displayName ?? null,
        note: entry.note,
        at: entry.createdAt.toISOString(),
      })),
      gateReasons: reasons,
      overrides: history.flatMap((entry): SignOffOverride[] =>
        entry.overrideReason !== null && isGatedCommand(entry.command)
          ? [
              {
                command: entry.command,
                actorId: entry.actorId,
                actorName: entry.actor?.displayName ?? null,
                reason: entry.overrideReason,
                overridden: entry.overridden ?? [],
                at: entry.createdAt.toISOString(),
              },
            ]
          : [],
      ),
    };
  }

  /**
   * Runs one Sign-off command. Illegal for the state, the role or the actor: 409 with the reason from
   * shared/src/reviews (nothing written). Submit names the reviewers; approve and return are for the
   * reviewers it was submitted to (or a lead); release needs an approval of this very revision and supersedes
   * the design's previously released revision. Submit, approve and release are refused with 409 gates_closed
   * while a gate is closed, unless the actor records an override with a reason (audited, mailed).
   */
  async transition(input: TransitionInput): Promise<SignOff> {
    const projectId = input.ref.projectId;
    const note = (input.note ?? '').trim();
    if (input.command === 'return' && !note) {
      throw new DomainError('invalid_argument', 'note is required to return a revision', 'note');
    }
    const overrideReason = input.override ? input.override.reason.trim() : null;
    if (overrideReason !== null) {
      const problem = overrideReasonProblem(overrideReason);
      if (problem) throw new DomainError('invalid_argument', problem, 'override.reason');
    }
    await this.sequelize.transaction(async (transaction) => {
      const { design, revision } = await this.lookup.find(input.ref, transaction);
      const from = revision.state;
      const to = applyTransition({
        command: input.command,
        from,
        actorRole: input.membership.role,
        isAuthor: revision.authorId === input.user.id,
        note,
      });
      const members = await this.members.findAll({
        where: { projectId },
        include: [UserModel],
        transaction,
      });
      let assigned = (await this.reviewers.findAll({ where: { revisionId: revision.id }, transaction })).map(
        (row) => row.userId,
      );

      if (input.command === 'submit') {
        assigned = this.checkReviewers(input.reviewerIds ?? [], members, revision.authorId);
        await this.reviewers.destroy({ where: { revisionId: revision.id }, transaction });
        await this.reviewers.bulkCreate(
          assigned.map((userId) => ({ revisionId: revision.id, userId })),
          { transaction },
        );
      }
      if ((input.command === 'approve' || input.command === 'return') && input.membership.role !== 'lead') {
        if (!assigned.includes(input.user.id)) {
          throw new DomainError(
            'forbidden',
            'This revision was submitted to other reviewers; only they or a lead may decide it',
          );
        }
      }

      if (input.command === 'release') await this.assertApproved(revision, transaction);
      const closed = isGatedCommand(input.command) ? await this.gateReasonsOf(revision, transaction) : [];
      if (closed.length > 0 && overrideReason === null) throw new GatesClosedException(input.command, closed);
      const override = closed.length > 0 && overrideReason !== null ? { reason: overrideReason, closed } : null;

      await revision.update({ state: to }, { transaction });
      await this.transitions.create(
        {
          revisionId: revision.id,
          command: input.command,
          fromState: from,
          toState: to,
          actorId: input.user.id,
          note,
          overrideReason: override?.reason ?? null,
          overridden: override?.closed ?? null,
        },
        { transaction },
      );
      if (override) {
        await this.audit.record(
          {
            action: 'revision.gates_overridden',
            actorId: input.user.id,
            actorEmail: input.user.email,
            subjectType: 'revision',
            subjectId: revision.id,
            detail: {
              projectId,
              designId: design.id,
              revisionNumber: revision.number,
              command: input.command,
              reason: override.reason,
              overridden: override.closed.map((reason) => reason.message),
            },
          },
          transaction,
        );
      }
      const superseded =
        input.command === 'release' ? await this.supersedeOthers(revision, input.user.id, transaction) : null;
      if (input.command === 'release') {
        await this.audit.record(
          {
            action: 'revision.released',
            actorId: input.user.id,
            actorEmail: input.user.email,
            subjectType: 'revision',
            subjectId: revision.id,
            detail: { projectId, designId: design.id, revisionNumber: revision.number, superseded },
          },
          transaction,
        );
      }

      const emailOf = (userId: string) => members.find((member) => member.userId === userId)?.user?.email;
      const emails = (ids: string[]) => ids.filter((id) => id !== input.user.id).flatMap((id) => emailOf(id) ?? []);
      const leads = members.filter((member) => member.role === 'lead').map((member) => member.userId);
      const recipients: Record<UserCommand, string[]> = {
        submit: emails(assigned),
        withdraw: emails(assigned),
        approve: [...emails([revision.authorId]), ...emails(leads)],
        return: emails([revision.authorId]),
        release: [...emails([revision.authorId]), ...emails(assigned)],
      };
      const mails: OutgoingMail[] = [
        transitionMail({
          command: input.command,
          about: this.mailSubject(projectId, design, revision.number),
          actorName: input.user.displayName,
          note,
          recipients: recipients[input.command],
          supersededNumber: superseded,
          override: override ? { reason: override.reason, overridden: override.closed.map((r) => r.message) } : null,
        }),
      ];
      await this.mail.enqueue(mails, transaction);
    });
    this.mail.kick();
    return this.get(input.ref, input.user, input.membership);
  }

  /** A release needs an approval of this revision since it was last submitted (the state alone is not proof). */
  private async assertApproved(revision: RevisionModel, transaction: Transaction): Promise<void> {
    const latest = await this.transitions.findOne({
      where: { revisionId: revision.id, command: { [Op.in]: ['submit', 'approve', 'return', 'withdraw'] } },
      order: [['createdAt', 'DESC']],
      transaction,
    });
    if (latest?.command !== 'approve') {
      throw new DomainError(
        'illegal_transition',
        `Revision ${revision.number} has no approval of its own since it was last submitted; it cannot be released`,
        'command',
      );
    }
  }

  /** Every reviewer id must be a project member with the reviewer or lead role, and not the author. */
  private checkReviewers(ids: string[], members: ProjectMemberModel[], authorId: string): string[] {
    ids.forEach((id, index) => {
      const field = `reviewerIds[${index}]`;
      const member = members.find((candidate) => candidate.userId === id);
      if (!member) throw new DomainError('invalid_argument', `${field} is not a member of this project`, field);
      if (!DECIDING_ROLES.includes(member.role)) {
        throw new DomainError(
          'invalid_argument',
          `${field} is a ${member.role}; reviewers must have the reviewer or lead role`,
          field,
        );
      }
      if (id === authorId)
        throw new DomainError(
          'invalid_argument',
          `${field} is the author, who cannot review their own revision`,
          field,
        );
    });
    return [...new Set(ids)];
  }

  /** Marks the design's other released revision superseded (at most one); returns its number. */
  private async supersedeOthers(
    released: RevisionModel,
    actorId: string,
    transaction: Transaction,
  ): Promise<number | null> {
    const previous = await this.revisions.findAll({
      where: { designId: released.designId, state: 'released', id: { [Op.ne]: released.id } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    for (const old of previous) {
      const to = applyTransition({ command: 'supersede', from: old.state, actorRole: 'system', isAuthor: false });
      await old.update({ state: to }, { transaction });
      await this.transitions.create(
        {
          revisionId: old.id,
          command: 'supersede',
          fromState: 'released',
          toState: to,
          actorId,
          note: `Superseded by revision ${released.number}`,
        },
        { transaction },
      );
    }
    return previous[0]?.number ?? null;
  }
}
