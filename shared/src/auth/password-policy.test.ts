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
  ])('%s -> %s', (password, expected) => {
    expect(passwordPolicyProblem(password)).toBe(expected);
  });
});
