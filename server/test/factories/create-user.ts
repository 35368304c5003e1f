import type { CurrentUser } from '@ladderwright/shared/api';
import type { UserRole } from '@ladderwright/shared/auth';
import { PasswordHasherService } from '../../src/users/password-hasher.service';
import { UserModel } from '../../src/users/user.model';
import type { TestApp } from '../utils/create-test-app';

/** Meets the password policy: 10+ characters, a letter and a digit. */
export const TEST_PASSWORD = 'Bench-check-42';

export interface TestUser extends CurrentUser {
  password: string;
}

let sequence = 0;

export async function createUser(
  testApp: TestApp,
  attrs: { role?: UserRole; email?: string; displayName?: string; password?: string } = {},
): Promise<TestUser> {
  sequence += 1;
  const role = attrs.role ?? 'engineer';
  const email = attrs.email ?? `${role}-${sequence}@northfold.test`;
  const password = attrs.password ?? TEST_PASSWORD;
  const hasher = testApp.app.get(PasswordHasherService);
  const user = await UserModel.create({
    email,
    displayName: attrs.displayName ?? `Test ${role} ${sequence}`,
    role,
    passwordHash: await hasher.hash(password),
  });
  return { id: user.id, email: user.email, displayName: user.displayName, role: user.role, password };
}
