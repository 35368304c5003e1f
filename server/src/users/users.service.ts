import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { CreateUserRequest, CurrentUser, UserSummary } from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
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
  ) {}

  async findCurrentUser(userId: string): Promise<CurrentUser | null> {
    if (!isUuid(userId)) return null;
    const user = await this.users.findByPk(userId);
    return user ? toCurrentUser(user) : null;
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

  async create(request: CreateUserRequest): Promise<UserSummary> {
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
    return toUserSummary(user);
  }

  async resetPassword(userId: string, password: string): Promise<void> {
    const user = isUuid(userId) ? await this.users.findByPk(userId) : null;
    if (!user) throw new DomainError('not_found', 'User not found', 'userId');
    user.passwordHash = await this.hasher.hash(password);
    await user.save();
  }

  async findIdByEmail(email: string): Promise<string | null> {
    const user = await this.users.findOne({ where: { email: normalizeEmail(email) }, attributes: ['id'] });
    return user?.id ?? null;
  }
}
