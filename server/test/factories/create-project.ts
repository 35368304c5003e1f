import type { ProjectRole } from '@ladderwright/shared/auth';
import { ProjectMemberModel } from '../../src/projects/project-member.model';
import { ProjectModel } from '../../src/projects/project.model';

export interface TestProject {
  id: string;
  name: string;
}

let sequence = 0;

export async function createProject(
  members: { userId: string; role: ProjectRole }[],
  attrs: { name?: string; productLine?: string } = {},
): Promise<TestProject> {
  sequence += 1;
  const project = await ProjectModel.create({
    name: attrs.name ?? `Test project ${sequence}`,
    productLine: attrs.productLine ?? 'Ionizers',
    description: '',
  });
  for (const member of members) {
    await ProjectMemberModel.create({ projectId: project.id, userId: member.userId, role: member.role });
  }
  return { id: project.id, name: project.name };
}
