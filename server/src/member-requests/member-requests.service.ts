import { Inject, Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { type Transaction, UniqueConstraintError } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { CreateMemberRequestRequest, CurrentUser, MemberRequest } from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
import { AuditService } from '../audit/audit.service';
import { isUuid } from '../common/uuid';
import type { ProjectMembership } from '../common/request.types';
import { APP_ENV, type AppEnv } from '../config/env';
import { MailService } from '../mail/mail.service';
import { ProjectMemberModel } from '../projects/project-member.model';
import { ProjectModel } from '../projects/project.model';
import { UserModel } from '../users/user.model';
import { normalizeEmail } from '../users/users.service';
import { MemberRequestModel } from './member-request.model';

/** Decided requests a lead's list still shows, newest first, below every pending one. */
const DECIDED_SHOWN = 50;

const WITH_PEOPLE = [
  { model: UserModel, as: 'requester', attributes: ['id', 'displayName', 'email'] },
  { model: UserModel, as: 'decidedBy', attributes: ['id', 'displayName'] },
];

function toMemberRequest(row: MemberRequestModel): MemberRequest {
  return {
    id: row.id,
    projectId: row.projectId,
    email: row.email,
    role: row.role,
    note: row.note,
    state: row.state,
    requesterId: row.requesterId ?? '',
    requesterName: row.requester?.displayName ?? '(a removed account)',
    createdAt: row.createdAt.toISOString(),
    decidedByName: row.decidedBy?.displayName ?? null,
    decidedAt: row.decidedAt ? row.decidedAt.toISOString() : null,
    declineReason: row.declineReason,
  };
}

/**
 * Member requests: a member who is not a lead asks that a person be added; the project's leads accept (the
 * person becomes a member with the proposed role) or decline with an optional reason. Every step is audited,
 * and the requester is told the outcome by mail (kind `members.request-decided`, which they may switch off).
 */
@Injectable()
export class MemberRequestsService {
  constructor(
    @InjectModel(MemberRequestModel) private readonly requests: typeof MemberRequestModel,
    @InjectModel(ProjectMemberModel) private readonly members: typeof ProjectMemberModel,
    @InjectModel(UserModel) private readonly users: typeof UserModel,
    private readonly sequelize: Sequelize,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    @Inject(APP_ENV) private readonly env: AppEnv,
  ) {}

  /** A lead sees every pending request and the latest decided ones; anyone else sees their own requests. */
  async list(membership: ProjectMembership, user: CurrentUser): Promise<MemberRequest[]> {
    const { projectId } = membership;
    if (membership.role !== 'lead') {
      const own = await this.requests.findAll({
        where: { projectId, requesterId: user.id },
        include: WITH_PEOPLE,
        order: [['createdAt', 'DESC']],
        limit: DECIDED_SHOWN,
      });
      return own.map(toMemberRequest);
    }
    const [pending, decided] = await Promise.all([
      this.requests.findAll({
        where: { projectId, state: 'pending' },
        include: WITH_PEOPLE,
        order: [['createdAt', 'ASC']],
      }),
      this.requests.findAll({
        where: { projectId, state: ['accepted', 'declined'] },
        include: WITH_PEOPLE,
        order: [['decidedAt', 'DESC']],
        limit: DECIDED_SHOWN,
      }),
    ]);
    return [...pending, ...decided].map(toMemberRequest);
  }

  /** 409 when the person is a member already or a request for them is pending. */
  async create(projectId: string, request: CreateMemberRequestRequest, actor: CurrentUser): Promise<MemberRequest> {
    const email = normalizeEmail(request.email);
    const id = await this.sequelize.transaction(async (transaction) => {
      await this.assertNotMember(projectId, email, transaction);
      const duplicate = await this.requests.findOne({ where: { projectId, email, state: 'pending' }, transaction });
      if (duplicate) throw this.pendingAlready();
      let row: MemberRequestModel;
      try {
        row = await this.requests.create(
          { projectId, requesterId: actor.id, email, role: request.role, note: request.note?.trim() ?? '' },
          { transaction },
        );
      } catch (error) {
        // Two requests for the same person at once: the partial unique index lets one through.
        if (error instanceof UniqueConstraintError) throw this.pendingAlready();
        throw error;
      }
      await this.audit.record(
        {
          action: 'project.member_requested',
          actorId: actor.id,
          actorEmail: actor.email,
          subjectType: 'project',
          subjectId: projectId,
          detail: { requestId: row.id, email, role: request.role },
        },
        transaction,
      );
      return row.id;
    });
    return this.get(projectId, id);
  }

  /** Adds the person with the proposed role. 409 when the request is decided, or the person has no account or is a member already. */
  async accept(projectId: string, requestId: string, actor: CurrentUser): Promise<MemberRequest> {
    await this.sequelize.transaction(async (transaction) => {
      const row = await this.lockPending(projectId, requestId, transaction);
      const user = await this.users.findOne({ where: { email: row.email }, attributes: ['id'], transaction });
      if (!user) {
        throw new DomainError(
          'illegal_transition',
          'No account has this e-mail yet: an admin creates it first, then accept again',
          'email',
        );
      }
      await this.assertNotMember(projectId, row.email, transaction);
      await this.members.create({ projectId, userId: user.id, role: row.role }, { transaction });
      await this.decide(row, 'accepted', null, actor, transaction);
      const audited = { actorId: actor.id, actorEmail: actor.email, subjectType: 'project', subjectId: projectId };
      await this.audit.record(
        {
          ...audited,
          action: 'project.member_added',
          detail: { userId: user.id, email: row.email, role: row.role, requestId: row.id },
        },
        transaction,
      );
    });
    return this.get(projectId, requestId);
  }

  async decline(
    projectId: string,
    requestId: string,
    reason: string | undefined,
    actor: CurrentUser,
  ): Promise<MemberRequest> {
    await this.sequelize.transaction(async (transaction) => {
      const row = await this.lockPending(projectId, requestId, transaction);
      await this.decide(row, 'declined', reason?.trim() || null, actor, transaction);
    });
    return this.get(projectId, requestId);
  }

  private async decide(
    row: MemberRequestModel,
    state: 'accepted' | 'declined',
    reason: string | null,
    actor: CurrentUser,
    transaction: Transaction,
  ): Promise<void> {
    row.state = state;
    row.decidedById = actor.id;
    row.decidedAt = new Date();
    row.declineReason = reason;
    await row.save({ transaction });
    await this.audit.record(
      {
        action: state === 'accepted' ? 'project.member_request_accepted' : 'project.member_request_declined',
        actorId: actor.id,
        actorEmail: actor.email,
        subjectType: 'project',
        subjectId: row.projectId,
        detail: { requestId: row.id, email: row.email, role: row.role, ...(reason ? { reason } : {}) },
      },
      transaction,
    );
    const [requester, project] = await Promise.all([
      row.requesterId ? this.users.findByPk(row.requesterId, { attributes: ['email'], transaction }) : null,
      ProjectModel.findByPk(row.projectId, { attributes: ['name'], transaction }),
    ]);
    if (!requester) return;
    const outcome = state === 'accepted' ? `accepted: ${row.email} is now a ${row.role} of the project` : 'declined';
    const url = `${this.env.publicUrl}/projects/${row.projectId}/members`;
    await this.mail.enqueue(
      [
        {
          kind: 'members.request-decided',
          recipients: [requester.email],
          subject: `[Ladderwright] Member request ${state}: ${row.email} in ${project?.name ?? 'a project'}`,
          body:
            `${actor.displayName} ${outcome}.` +
            (reason ? `\n\nReason: ${reason}` : '') +
            `\n\nOpen the Members page: ${url}\n\n-- \nLadderwright notification.`,
        },
      ],
      transaction,
    );
  }

  private async get(projectId: string, requestId: string): Promise<MemberRequest> {
    if (!isUuid(requestId)) throw new DomainError('not_found', 'Member request not found', 'requestId');
    const row = await this.requests.findOne({ where: { id: requestId, projectId }, include: WITH_PEOPLE });
    if (!row) throw new DomainError('not_found', 'Member request not found', 'requestId');
    return toMemberRequest(row);
  }

  private async lockPending(
    projectId: string,
    requestId: string,
    transaction: Transaction,
  ): Promise<MemberRequestModel> {
    const row = isUuid(requestId)
      ? await this.requests.findOne({ where: { id: requestId, projectId }, transaction, lock: transaction.LOCK.UPDATE })
      : null;
    if (!row) throw new DomainError('not_found', 'Member request not found', 'requestId');
    if (row.state !== 'pending') {
      throw new DomainError('illegal_transition', `This request was ${row.state} already`, 'requestId');
    }
    return row;
  }

  private async assertNotMember(projectId: string, email: string, transaction: Transaction): Promise<void> {
    const member = await this.members.findOne({
      where: { projectId },
      include: [{ model: UserModel, where: { email }, attributes: [] }],
      transaction,
    });
    if (member) throw new DomainError('illegal_transition', 'This person is a member of the project already', 'email');
  }

  private pendingAlready(): DomainError {
    return new DomainError('illegal_transition', 'A request for this person is pending already', 'email');
  }
}
