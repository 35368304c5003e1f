import { describe, expect, it } from 'vitest';
import { canActInProject, canInProject } from './permissions';

// Rule: an archived project allows only what changes nothing (this product's policy, no outside source).
describe('canActInProject', () => {
  it('follows the role in an open project', () => {
    expect(canActInProject({ myRole: 'engineer', isArchived: false }, 'design.write')).toBe(true);
    expect(canActInProject({ myRole: 'reviewer', isArchived: false }, 'design.write')).toBe(false);
    expect(canActInProject({ myRole: 'lead', isArchived: false }, 'members.manage')).toBe(true);
  });

  it('allows only reading and exporting in an archived project, whatever the role', () => {
    const archivedLead = { myRole: 'lead', isArchived: true } as const;
    for (const action of [
      'design.write',
      'revision.submit',
      'bench.upload',
      'members.manage',
      'review.comment',
    ] as const)
      expect(canActInProject(archivedLead, action)).toBe(false);
    expect(canActInProject(archivedLead, 'project.read')).toBe(true);
    expect(canActInProject(archivedLead, 'specSheet.export')).toBe(canInProject('lead', 'specSheet.export'));
    expect(canActInProject({ myRole: 'reviewer', isArchived: true }, 'specSheet.exportDraft')).toBe(false);
  });
});
