import { describe, expect, it } from 'vitest';
import { jsonLimitIssue, type JsonLimits } from './json-limits';

// The limits and the path notation are ours (field-path.ts); the cases are common practice, no source.
const limits: JsonLimits = { maxDepth: 4, maxBytes: 1_000, checkText: true };

describe('jsonLimitIssue', () => {
  it('names the path of a bad string under objects, lists and a quoted key', () => {
    const value = { a: { list: ['ok', { 'odd key': ['fine', 'bad\u0000'] }] } };
    expect(jsonLimitIssue(value, { ...limits, maxDepth: 8 }, 'body')).toEqual({
      path: 'body.a.list[1]["odd key"][1]',
      message: 'contains the control character U+0000',
    });
  });

  it('names the path of a bad key, the key itself included', () => {
    expect(jsonLimitIssue({ a: [{ ['k\uD800']: 1 }] }, limits)).toEqual({
      path: 'a[0]["k\\ud800"]',
      message: 'key contains an unpaired UTF-16 surrogate',
    });
  });

  it('names the first value nested too deep, and the root label for the value itself', () => {
    expect(jsonLimitIssue({ a: [[{ b: {} }]] }, limits)).toEqual({
      path: 'a[0][0].b',
      message: 'nests deeper than 4 levels',
    });
    expect(jsonLimitIssue('x\u0001', limits, '', '(body)')).toEqual({
      path: '(body)',
      message: 'contains the control character U+0001',
    });
  });

  it('states the size at the root path, and nothing for a value within every limit', () => {
    expect(jsonLimitIssue({ text: 'x'.repeat(400) }, limits, 'doc')).toEqual({
      path: 'doc',
      message: 'is larger than 1000 bytes as JSON text',
    });
    expect(jsonLimitIssue({ a: [1, 'two', { c: null }] }, limits)).toBeNull();
  });
});
