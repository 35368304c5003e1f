import { describe, expect, it } from 'vitest';
import { passwordPolicyProblem } from './password-policy';

// Policy from issue 2 (>= 10 characters, a letter and a digit): common practice, no source.
describe('passwordPolicyProblem', () => {
  it.each([
    ['Northfold-demo-1', null],
    ['abcdefghi1', null],
    ['abcdefgh1', 'must be at least 10 characters long'],
    ['abcdefghij', 'must contain a digit'],
    ['1234567890', 'must contain a letter'],
    ['Ölfilter-12', null],
    // 72 bytes is bcrypt's input limit (Provos and Mazières 1999): 71 ASCII + a digit passes, 73 does not.
    [`${'a'.repeat(71)}1`, null],
    [`${'a'.repeat(72)}1`, 'must be at most 72 bytes in UTF-8 (the password hash uses no more)'],
    // 'Ö' is 2 bytes in UTF-8: 35 of them + '12' = 72 bytes; 36 + '12' = 74.
    [`${'Ö'.repeat(35)}12`, null],
    [`${'Ö'.repeat(36)}12`, 'must be at most 72 bytes in UTF-8 (the password hash uses no more)'],
  ])('%s -> %s', (password, expected) => {
    expect(passwordPolicyProblem(password)).toBe(expected);
  });
});
