import { compare, hash } from 'bcryptjs';

/*
 * Worker-thread entry (piscina) for bcrypt: a hash costs tens of milliseconds of CPU, which on the request
 * thread would stall every other request (bcryptjs's async API only yields between rounds, on the same thread).
 */

export interface HashTask {
  password: string;
  rounds: number;
}

export interface VerifyTask {
  password: string;
  passwordHash: string;
}

export function hashPassword(task: HashTask): Promise<string> {
  return hash(task.password, task.rounds);
}

export function verifyPassword(task: VerifyTask): Promise<boolean> {
  return compare(task.password, task.passwordHash);
}
