import { beforeEach, describe, expect, it, vi } from 'vitest';
import { packCheckRules, type RevisionDetail } from '@ladderwright/shared/api';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { designExamples, validateDesign } from '@ladderwright/shared/designs';
import { jsonResponse } from '../../../testing/render';
import { getRevision } from './get-revision';

const fetchMock = vi.fn<typeof fetch>();

const document = validateDesign(designExamples.detectorBias);
const report = analyzeDesign(document);
const head = {
  number: 1,
  state: 'draft',
  authorId: 'u-eng',
  authorName: 'Northfold Engineer',
  createdAt: '2025-03-04T10:00:00.000Z',
  changeNote: 'Created',
  baseRevisionNumber: null,
  engineVersion: report.engineVersion,
  designId: 'd-1',
  projectId: 'p-1',
  document,
} as const;

describe('getRevision', () => {
  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });

  it('looks each check’s rule up in the map the server sends once', async () => {
    fetchMock.mockResolvedValue(jsonResponse({ ...head, report: packCheckRules(report) }));
    const revision: RevisionDetail = await getRevision('p-1', 'd-1', 1);
    expect(revision.report.checks).toEqual(JSON.parse(JSON.stringify(report.checks)));
    expect(revision.report).not.toHaveProperty('checkRules');
  });

  it('takes a report whose checks carry their rules inline as it is', async () => {
    fetchMock.mockResolvedValue(jsonResponse({ ...head, report }));
    const revision = await getRevision('p-1', 'd-1', 1);
    expect(revision.report.checks.map((check) => check.rule)).toEqual(report.checks.map((check) => check.rule));
  });
});
