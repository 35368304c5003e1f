import { Inject, Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type {
  AddMemberRequest,
  ChangeMemberRoleRequest,
  CurrentUser,
  CreateProjectRequest,
  ProjectDetail,
  ProjectMember,
  ProjectSettings,
  ProjectSummary,
  UpdateProjectRequest,
} from '@ladderwright/shared/api';
import type { ProjectRole } from '@ladderwright/shared/auth';
import { DomainError } from '@ladderwright/shared/errors';
import { DEFAULT_ACCEPTANCE_SETTINGS } from '@ladderwright/shared/reviews';
import { AuditService } from '../audit/audit.service';
import { isUuid } from '../common/uuid';
import { APP_ENV, type AppEnv } from '../config/env';
import { UserModel } from '../users/user.model';
import { UsersService } from '../users/users.service';
import { MemberStandingCache, type MemberStanding } from './member-standing-cache';
import { ProjectMemberModel } from './project-member.model';
import { ProjectModel } from './project.model';

function settingsOf(stored: Partial<ProjectSettings>): ProjectSettings {
  return {
    defaultTargets: { ...(stored.defaultTargets ?? {}) },
    acceptance: { ...DEFAULT_ACCEPTANCE_SETTINGS, ...(stored.acceptance ?? {}) },
  };
}

function toMember(member: ProjectMemberModel): ProjectMember {
  const user = member.user;
  if (!user) throw new Error('project member loaded without its user');
  return { userId: member.userId, email: user.email, displayName: user.displayName, role: member.role };
}

@Injectable()
export class ProjectsService {
  /** Standing lookups under way, by project and user; a lookup asked for meanwhile shares the answer. */
  private readonly standingsInFlight = new Map<string, Promise<MemberStanding>>();
  private readonly standings: MemberStandingCache;

  constructor(
    @InjectModel(ProjectModel) private readonly projects: typeof ProjectModel,
    @InjectModel(ProjectMemberModel) private readonly members: typeof ProjectMemberModel,
    private readonly users: UsersService,
    private readonly sequelize: Sequelize,
    private readonly audit: AuditService,
    @Inject(APP_ENV) env: AppEnv,
  ) {
    this.standings = new MemberStandingCache(env.sessionCacheMs);
  }

  /** The user's role in the project and whether the project is archived; null for a non-member. */
  findMemberStanding(projectId: string, userId: string): Promise<MemberStanding> {
    if (!isUuid(projectId) || !isUuid(userId)) return Promise.resolve(null);
    // Every request to a project asks this first: a burst of one person's requests (a client saving many
    // designs) asks it once, not once per request ahead of everyone else's queries in the pool's queue. A
    // lookup that joins one under way gets the answer of a query that started no earlier than its own wait.
    // A standing read in the last SESSION_CACHE_MS answers without a query (MemberStandingCache).
    const key = MemberStandingCache.key(projectId, userId);
    const cached = this.standings.get(key, Date.now());
    if (cached !== undefined) return Promise.resolve(cached);
    const inFlight = this.standingsInFlight.get(key);
    if (inFlight) return inFlight;
    const epoch = this.standings.currentEpoch();
    const lookup = this.queryMemberStanding(projectId, userId)
      .then((standing) => {
        this.standings.set(key, standing, epoch, Date.now());
        return standing;
      })
      .finally(() => {
        if (this.standingsInFlight.get(key) === lookup) this.standingsInFlight.delete(key);
      });
    this.standingsInFlight.set(key, lookup);
    return lookup;
  }

  /** Forgets the cached standings in the project and the lookups under way; call once a change committed. */
  forgetStandings(projectId: string): void {
    this.standings.forgetProject(projectId);
    const prefix = `${projectId}/`;
    for (const key of this.standingsInFlight.keys()) {
      if (key.startsWith(prefix)) this.standingsInFlight.delete(key);
    }
  }

  private async queryMemberStanding(projectId: string, userId: string): Promise<MemberStanding> {
    const member = await this.members.findOne({
      where: { projectId, userId },
      attributes: ['role'],
      include: [{ model: ProjectModel, attributes: ['archivedAt'] }],
    });
    return member ? { role: member.role, isArchived: (member.project?.archivedAt ?? null) !== null } : null;
  }

  /** The project's settings with the defaults filled in. */
  async settings(projectId: string): Promise<ProjectSettings> {
    const project = await this.projects.findByPk(projectId, { attributes: ['settings'] });
    return settingsOf(project?.settings ?? {});
  }

  /** Name, description, default targets and acceptance window; each change is audited with its fields. */
  async update(projectId: string, request: UpdateProjectRequest, actor: CurrentUser): Promise<ProjectDetail> {
    await this.sequelize.transaction(async (transaction) => {
      const project = await this.projects.findByPk(projectId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!project) throw new DomainError('not_found', 'Project not found', 'projectId');
      const changed: string[] = [];
      if (request.name !== undefined && request.name.trim() !== project.name) {
        project.name = request.name.trim();
        changed.push('name');
      }
      if (request.description !== undefined && request.description.trim() !== project.description) {
        project.description = request.description.trim();
        changed.push('description');
      }
      const settings = settingsOf(project.settings);
      if (request.defaultTargets !== undefined) {
        settings.defaultTargets = { ...request.defaultTargets };
        changed.push('defaultTargets');
      }
      if (request.acceptance !== undefined) {
        settings.acceptance = { ...request.acceptance };
        changed.push('acceptance');
      }
      project.settings = settings;
      await project.save({ transaction });
      if (changed.length > 0) {
        await this.audit.record(
          {
            action: 'project.settings_changed',
            actorId: actor.id,
            actorEmail: actor.email,
            subjectType: 'project',
            subjectId: projectId,
            detail: { changed, settings },
          },
          transaction,
        );
      }
    });
    const role = (await this.findMemberStanding(projectId, actor.id))?.role ?? 'lead';
    return this.detail(projectId, role);
  }

  /** Archives the project: it stays listed and readable and takes no more changes. */
  archive(projectId: string, actor: CurrentUser): Promise<void> {
    return this.setArchived(projectId, true, actor);
  }

  /** Takes the project out of the archive: it takes changes again. 409 when it is not archived. */
  unarchive(projectId: string, actor: CurrentUser): Promise<void> {
    return this.setArchived(projectId, false, actor);
  }

  private async setArchived(projectId: string, isArchived: boolean, actor: CurrentUser): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      const project = await this.projects.findByPk(projectId, { transaction, lock: transaction.LOCK.UPDATE });
      if (!project) throw new DomainError('not_found', 'Project not found', 'projectId');
      if ((project.archivedAt !== null) === isArchived) {
        throw new DomainError(
          'illegal_transition',
          isArchived ? 'This project is archived already' : 'This project is not archived',
        );
      }
      project.archivedAt = isArchived ? new Date() : null;
      await project.save({ transaction });
      await this.audit.record(
        {
          action: isArchived ? 'project.archived' : 'project.unarchived',
          actorId: actor.id,
          actorEmail: actor.email,
          subjectType: 'project',
          subjectId: projectId,
          detail: { name: project.name },
        },
        transaction,
      );
    });
    this.forgetStandings(projectId);
  }

  /** The projects `userId` is a member of, with that user's role and the member count. */
  /** The caller's projects, member counts included, in one query; active ones first, then by name. */
  async listForUser(userId: string): Promise<ProjectSummary[]> {
    const rows = await this.sequelize.query<ProjectSummary>(
      `SELECT p.id, p.name, p.product_line AS "productLine", p.description, m.role AS "myRole",
              (SELECT count(*)::int FROM project_members c WHERE c.project_id = p.id) AS "memberCount",
              p.archived_at IS NOT NULL AS "isArchived"
         FROM project_members m
         JOIN projects p ON p.id = m.project_id
        WHERE m.user_id = :userId`,
      { replacements: { userId }, type: QueryTypes.SELECT },
    );
    return rows.sort((a, b) => Number(a.isArchived) - Number(b.isArchived) || a.name.localeCompare(b.name));
  }

  async detail(projectId: string, myRole: ProjectRole): Promise<ProjectDetail> {
    const [project, members] = await Promise.all([this.projects.findByPk(projectId), this.listMembers(projectId)]);
    if (!project) throw new DomainError('not_found', 'Project not found', 'projectId');
    return { ...this.toSummary(project, myRole, members.length), members, settings: settingsOf(project.settings) };
  }

  async listMembers(projectId: string): Promise<ProjectMember[]> {
    const rows = await this.members.findAll({ where: { projectId }, include: [UserModel] });
    return rows.map(toMember).sort((a, b) => a.email.localeCompare(b.email));
  }

  /** Creates a project with `creatorId` as its lead. */
  async create(request: CreateProjectRequest, creatorId: string): Promise<ProjectSummary> {
    return this.sequelize.transaction(async (transaction) => {
      const project = await this.projects.create(
        {
          name: request.name.trim(),
          productLine: request.productLine.trim(),
          description: request.description?.trim() ?? '',
        },
        { transaction },
      );
      await this.members.create({ projectId: project.id, userId: creatorId, role: 'lead' }, { transaction });
      return this.toSummary(project, 'lead', 1);
    });
  }

  /** Changes a member's project role; the last lead keeps the lead role (409). */
  async changeMemberRole(
    projectId: string,
    userId: string,
    request: ChangeMemberRoleRequest,
    actor: CurrentUser,
  ): Promise<ProjectMember> {
    const member = isUuid(userId)
      ? await this.members.findOne({ where: { projectId, userId }, include: [UserModel] })
      : null;
    if (!member?.user) throw new DomainError('not_found', 'This account is not a member of the project', 'userId');
    return this.addMember(projectId, { email: member.user.email, role: request.role }, actor);
  }

  /** Adds the account with `request.email` to the project, or changes its role when already a member. */
  async addMember(projectId: string, request: AddMemberRequest, actor: CurrentUser): Promise<ProjectMember> {
    const userId = await this.users.findIdByEmail(request.email);
    if (!userId) throw new DomainError('invalid_argument', 'No account has this e-mail', 'email');
    await this.sequelize.transaction(async (transaction) => {
      const existing = await this.members.findOne({
        where: { projectId, userId },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      const audited = { actorId: actor.id, actorEmail: actor.email, subjectType: 'project', subjectId: projectId };
      if (!existing) {
        await this.members.create({ projectId, userId, role: request.role }, { transaction });
        await this.audit.record(
          { ...audited, action: 'project.member_added', detail: { userId, email: request.email, role: request.role } },
          transaction,
        );
        return;
      }
      if (existing.role === 'lead' && request.role !== 'lead')
        await this.assertAnotherLead(projectId, userId, transaction);
      const fromRole = existing.role;
      existing.role = request.role;
      await existing.save({ transaction });
      if (fromRole !== request.role) {
        await this.audit.record(
          {
            ...audited,
            action: 'project.member_role_changed',
            detail: { userId, email: request.email, fromRole, toRole: request.role },
          },
          transaction,
        );
      }
    });
    this.forgetStandings(projectId);
    const member = await this.members.findOne({ where: { projectId, userId }, include: [UserModel] });
    if (!member) throw new Error('member vanished after it was written');
    return toMember(member);
  }

  async removeMember(projectId: string, userId: string, actor: CurrentUser): Promise<void> {
    await this.sequelize.transaction(async (transaction) => {
      const member = isUuid(userId)
        ? await this.members.findOne({ where: { projectId, userId }, transaction, lock: transaction.LOCK.UPDATE })
        : null;
      if (!member) throw new DomainError('not_found', 'This account is not a member of the project', 'userId');
      if (member.role === 'lead') await this.assertAnotherLead(projectId, userId, transaction);
      await member.destroy({ transaction });
      await this.audit.record(
        {
          action: 'project.member_removed',
          actorId: actor.id,
          actorEmail: actor.email,
          subjectType: 'project',
          subjectId: projectId,
          detail: { userId, role: member.role },
        },
        transaction,
      );
    });
    this.forgetStandings(projectId);
  }

  private async assertAnotherLead(projectId: string, userId: string, transaction: Transaction): Promise<void> {
    const leads = await this.members.findAll({ where: { projectId, role: 'lead' }, transaction, lock: true });
    if (!leads.some((lead) => lead.userId !== userId)) {
      throw new DomainError(
        'illegal_transition',
        'A project keeps at least one lead: make another member lead first',
        'userId',
      );
    }
  }

  private toSummary(project: ProjectModel, myRole: ProjectRole, memberCount: number): ProjectSummary {
    return {
      id: project.id,
      name: project.name,
      productLine: project.productLine,
      description: project.description,
      myRole,
      memberCount,
      isArchived: project.archivedAt !== null,
    };
  }
}
