import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { CreateUserRequest, CurrentUser, UserSummary } from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
import { AuditService } from '../audit/audit.service';
import { SessionCacheService } from '../auth/session-cache.service';
import { isUuid } from '../common/uuid';
import { PasswordHasherService } from './password-hasher.service';
import { UserModel } from './user.model';

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

function toCurrentUser(user: UserModel): CurrentUser {
  return { id: user.id, email: user.email, displayName: user.displayName, role: user.role };
}

function toUserSummary(user: UserModel): UserSummary {
  return { ...toCurrentUser(user), createdAt: user.createdAt.toISOString() };
}

@Injectable()
export class UsersService {
  constructor(
    @InjectModel(UserModel) private readonly users: typeof UserModel,
    private readonly hasher: PasswordHasherService,
    private readonly audit: AuditService,
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
    return (await this.hasher.verify(password, user.passwordHash)) ? toCurrentUser(user) : null;
  }

  async list(): Promise<UserSummary[]> {
    const users = await this.users.findAll({ order: [['email', 'ASC']] });
    return users.map(toUserSummary);
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

  async findIdByEmail(email: string): Promise<string | null> {
    const user = await this.users.findOne({ where: { email: normalizeEmail(email) }, attributes: ['id'] });
    return user?.id ?? null;
  }
}
