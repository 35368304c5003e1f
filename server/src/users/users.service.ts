import { createHash, randomBytes } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type WhereOptions } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type {
  CreateUserRequest,
  CurrentUser,
  NotificationSettings,
  PasswordResetLink,
  UpdateUserRequest,
  UserPage,
  UserSummary,
} from '@ladderwright/shared/api';
import { MAIL_KINDS } from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
import { AuditService } from '../audit/audit.service';
import { SessionCacheService } from '../auth/session-cache.service';
import { isUuid } from '../common/uuid';
import { APP_ENV, type AppEnv } from '../config/env';
import { MailService } from '../mail/mail.service';
import type { ListUsersDto } from './dto/list-users.dto';
import { PasswordHasherService } from './password-hasher.service';
import { PasswordResetLinkModel } from './password-reset-link.model';
import { UserModel } from './user.model';

/** How long a password-reset link stays good (common practice, no source). */
export const PASSWORD_RESET_TTL_MS = 24 * 60 * 60 * 1000;

function tokenHashOf(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, '\\$&')}%`;
}

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

function toCurrentUser(user: UserModel): CurrentUser {
  return { id: user.id, email: user.email, displayName: user.displayName, role: user.role };
}

function toUserSummary(user: UserModel): UserSummary {
  return { ...toCurrentUser(user), createdAt: user.createdAt.toISOString(), isActive: user.isActive };
}

@Injectable()
export class UsersService {
  constructor(
    @InjectModel(UserModel) private readonly users: typeof UserModel,
    @InjectModel(PasswordResetLinkModel) private readonly resetLinks: typeof PasswordResetLinkModel,
    @Inject(APP_ENV) private readonly env: AppEnv,
    private readonly hasher: PasswordHasherService,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly sequelize: Sequelize,
    private readonly sessionCache: SessionCacheService,
  ) {}

  async findCurrentUser(userId: string): Promise<CurrentUser | null> {
    if (!isUuid(userId)) return null;
    const user = await this.users.findByPk(userId);
    return user ? toCurrentUser(user) : null;
  }

  async sessionVersionOf(userId: string): Promise<number> {
    const user = await this.users.findByPk(userId, { attributes: ['sessionVersion'] });
    if (!user) throw new DomainError('not_found', 'User not found', 'userId');
    return user.sessionVersion;
  }

  /** Invalidates every session token issued to the account so far. */
  async revokeSessions(userId: string): Promise<void> {
    await this.users.increment('sessionVersion', { where: { id: userId } });
    this.sessionCache.forgetUser(userId);
  }

  /** The account for `email` if `password` matches it; null otherwise (same timing either way). */
  async verifyCredentials(email: string, password: string): Promise<CurrentUser | null> {
    const user = await this.users.findOne({ where: { email: normalizeEmail(email) } });
    if (!user) return this.hasher.verifyAgainstNothing(password).then(() => null);
    const matches = await this.hasher.verify(password, user.passwordHash);
    // A deactivated account is refused like a wrong password, after the same work.
    return matches && user.isActive ? toCurrentUser(user) : null;
  }

  /** One page of accounts by e-mail, filtered by part of the e-mail or name and by state. */
  async list(query: ListUsersDto): Promise<UserPage> {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 25;
    const conditions: WhereOptions<UserModel>[] = [];
    const text = query.q?.trim();
    if (text) {
      conditions.push({
        [Op.or]: [{ email: { [Op.iLike]: likePattern(text) } }, { displayName: { [Op.iLike]: likePattern(text) } }],
      });
    }
    if (query.status) conditions.push({ isActive: query.status === 'active' });
    const { rows, count } = await this.users.findAndCountAll({
      where: { [Op.and]: conditions },
      order: [['email', 'ASC']],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    return { items: rows.map(toUserSummary), total: count, page, pageSize };
  }

  /**
   * Changes the account role and/or deactivates or reactivates the account. Deactivating ends every session
   * of the account. An admin cannot change or deactivate their own account (someone else must).
   */
  async update(userId: string, request: UpdateUserRequest, actor: CurrentUser): Promise<UserSummary> {
    const user = isUuid(userId) ? await this.users.findByPk(userId) : null;
    if (!user) throw new DomainError('not_found', 'User not found', 'userId');
    if (user.id === actor.id && (request.role !== undefined || request.isActive !== undefined)) {
      throw new DomainError(
        'illegal_transition',
        'Admins cannot change the role of, or deactivate, their own account; ask another admin',
        'userId',
      );
    }
    await this.sequelize.transaction(async (transaction) => {
      const audited = { actorId: actor.id, actorEmail: actor.email, subjectType: 'user', subjectId: user.id };
      if (request.role !== undefined && request.role !== user.role) {
        const fromRole = user.role;
        user.role = request.role;
        await this.audit.record(
          { ...audited, action: 'user.role_changed', detail: { email: user.email, fromRole, toRole: request.role } },
          transaction,
        );
      }
      if (request.isActive !== undefined && request.isActive !== user.isActive) {
        user.isActive = request.isActive;
        if (!request.isActive) user.sessionVersion += 1;
        await this.audit.record(
          {
            ...audited,
            action: request.isActive ? 'user.reactivated' : 'user.deactivated',
            detail: { email: user.email, ...(request.isActive ? {} : { sessionsRevoked: true }) },
          },
          transaction,
        );
      }
      await user.save({ transaction });
    });
    // Role and standing are cached with the session: forget them so the change applies at once.
    this.sessionCache.forgetUser(user.id);
    return toUserSummary(user);
  }

  /**
   * Issues a one-time password-reset link (older unused links of the account stop working). `show` returns
   * the link once; `mail` queues it to the account's e-mail and returns no link.
   */
  async createResetLink(
    userId: string,
    delivery: 'show' | 'mail',
    actor: CurrentUser,
    now: Date,
  ): Promise<PasswordResetLink> {
    const user = isUuid(userId) ? await this.users.findByPk(userId) : null;
    if (!user) throw new DomainError('not_found', 'User not found', 'userId');
    if (!user.isActive) {
      throw new DomainError('illegal_transition', 'Reactivate the account before resetting its password', 'userId');
    }
    const token = randomBytes(32).toString('base64url');
    const expiresAt = new Date(now.getTime() + PASSWORD_RESET_TTL_MS);
    const url = `${this.env.publicUrl}/reset-password?token=${token}`;
    await this.sequelize.transaction(async (transaction) => {
      await this.resetLinks.update({ usedAt: now }, { where: { userId: user.id, usedAt: null }, transaction });
      await this.resetLinks.create(
        { userId: user.id, tokenHash: tokenHashOf(token), expiresAt, createdBy: actor.id },
        { transaction },
      );
      await this.audit.record(
        {
          action: 'user.password_reset',
          actorId: actor.id,
          actorEmail: actor.email,
          subjectType: 'user',
          subjectId: user.id,
          detail: { email: user.email, delivery, expiresAt: expiresAt.toISOString() },
        },
        transaction,
      );
      if (delivery === 'mail') {
        await this.mail.enqueue(
          [
            {
              kind: 'account.password_reset',
              recipients: [user.email],
              subject: '[Ladderwright] Set a new password',
              body:
                `${actor.displayName} issued a link for you to set a new Ladderwright password. It works once, ` +
                `until ${expiresAt.toISOString()}:\n\n${url}\n\nIf you did not expect this, tell your admin.`,
            },
          ],
          transaction,
        );
      }
    });
    if (delivery === 'mail') this.mail.kick();
    return {
      url: delivery === 'show' ? url : null,
      expiresAt: expiresAt.toISOString(),
      mailedTo: delivery === 'mail' ? user.email : null,
    };
  }

  /**
   * Sets a new password with a one-time link's token and ends the account's sessions. An unknown, used or
   * expired token is refused with one message (400 naming `token`).
   */
  async completeReset(token: string, password: string, now: Date): Promise<void> {
    const passwordHash = await this.hasher.hash(password);
    const userId = await this.sequelize.transaction(async (transaction) => {
      const link = await this.resetLinks.findOne({
        where: { tokenHash: tokenHashOf(token) },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      const user = link ? await this.users.findByPk(link.userId, { transaction }) : null;
      if (!link || !user || link.usedAt !== null || link.expiresAt <= now || !user.isActive) {
        throw new DomainError(
          'invalid_argument',
          'This password-reset link is not valid any more: ask your admin for a new one',
          'token',
        );
      }
      await link.update({ usedAt: now }, { transaction });
      user.passwordHash = passwordHash;
      user.sessionVersion += 1;
      await user.save({ transaction });
      await this.audit.record(
        {
          action: 'auth.password_reset_completed',
          actorId: user.id,
          actorEmail: user.email,
          subjectType: 'user',
          subjectId: user.id,
          detail: { sessionsRevoked: true },
        },
        transaction,
      );
      return user.id;
    });
    this.sessionCache.forgetUser(userId);
  }

  /** `actor`: the admin creating the account, for the audit log. */
  async create(request: CreateUserRequest, actor: CurrentUser): Promise<UserSummary> {
    const email = normalizeEmail(request.email);
    if (await this.users.findOne({ where: { email } })) {
      throw new DomainError('invalid_argument', 'An account with this e-mail already exists', 'email');
    }
    const user = await this.users.create({
      email,
      displayName: request.displayName.trim(),
      role: request.role,
      passwordHash: await this.hasher.hash(request.password),
    });
    await this.audit.record({
      action: 'user.created',
      actorId: actor.id,
      actorEmail: actor.email,
      subjectType: 'user',
      subjectId: user.id,
      detail: { email: user.email, role: user.role },
    });
    return toUserSummary(user);
  }

  async resetPassword(userId: string, password: string, actor: CurrentUser): Promise<void> {
    const user = isUuid(userId) ? await this.users.findByPk(userId) : null;
    if (!user) throw new DomainError('not_found', 'User not found', 'userId');
    user.passwordHash = await this.hasher.hash(password);
    // A reset password also ends the sessions opened with the old one.
    user.sessionVersion += 1;
    await user.save();
    this.sessionCache.forgetUser(user.id);
    await this.audit.record({
      action: 'user.password_reset',
      actorId: actor.id,
      actorEmail: actor.email,
      subjectType: 'user',
      subjectId: user.id,
      detail: { email: user.email, sessionsRevoked: true },
    });
  }

  /** For each mail kind, whether the user receives it. */
  async notificationSettings(userId: string): Promise<NotificationSettings> {
    const user = await this.users.findByPk(userId, { attributes: ['mailOptOuts'] });
    if (!user) throw new DomainError('not_found', 'User not found', 'userId');
    return Object.fromEntries(
      MAIL_KINDS.map((kind) => [kind, !user.mailOptOuts.includes(kind)]),
    ) as NotificationSettings;
  }

  async setNotificationSettings(userId: string, settings: NotificationSettings): Promise<NotificationSettings> {
    const mailOptOuts = MAIL_KINDS.filter((kind) => !settings[kind]);
    await this.users.update({ mailOptOuts }, { where: { id: userId } });
    return this.notificationSettings(userId);
  }

  async findIdByEmail(email: string): Promise<string | null> {
    const user = await this.users.findOne({ where: { email: normalizeEmail(email) }, attributes: ['id'] });
    return user?.id ?? null;
  }
}
