import type { ProjectRole, UserRole } from '@ladderwright/shared/auth';
import { seedDemoDesigns } from '../designs/seed-demo-designs';
import { ProjectMemberModel } from '../projects/project-member.model';
import { seedDemoParts } from '../parts/seed-demo-parts';
import { ProjectModel } from '../projects/project.model';
import type { PasswordHasherService } from '../users/password-hasher.service';
import { UserModel } from '../users/user.model';

/** Demo password for every demo account; it satisfies the password policy. */
export const DEMO_PASSWORD = 'Northfold-demo-1';

interface DemoUser {
  email: string;
  displayName: string;
  role: UserRole;
}

interface DemoProject {
  name: string;
  productLine: string;
  description: string;
  members: { email: string; role: ProjectRole }[];
}

export const DEMO_USERS: readonly DemoUser[] = [
  { email: 'engineer@northfold.test', displayName: 'Northfold Engineer', role: 'engineer' },
  { email: 'reviewer@northfold.test', displayName: 'Northfold Reviewer', role: 'reviewer' },
  { email: 'lead@northfold.test', displayName: 'Northfold Lead', role: 'lead' },
  { email: 'admin@northfold.test', displayName: 'Northfold Admin', role: 'admin' },
  { email: 'field-engineer@northfold.test', displayName: 'Northfold Field Engineer', role: 'engineer' },
];

const CORE_TEAM: DemoProject['members'] = [
  { email: 'engineer@northfold.test', role: 'engineer' },
  { email: 'reviewer@northfold.test', role: 'reviewer' },
  { email: 'lead@northfold.test', role: 'lead' },
];

export const DEMO_PROJECTS: readonly DemoProject[] = [
  {
    name: 'Cleanroom ionizer bar',
    productLine: 'Ionizers',
    description: 'About 6 kV negative, tens of microamps, 12 V input; many-cell half-wave ladder.',
    members: CORE_TEAM,
  },
  {
    name: 'Detector tube bias',
    productLine: 'Detector supplies',
    description: 'About 900 V, a few microamps from one lithium-ion cell; very low ripple; tripler.',
    members: CORE_TEAM,
  },
  {
    name: 'Range-hood precipitator cell',
    productLine: 'Precipitators',
    description: 'About 4 kV, a few hundred microamps, 12 V input; full-wave cascade.',
    members: CORE_TEAM,
  },
  {
    name: 'Handheld surface-charge tester',
    productLine: 'Field instruments',
    description:
      'Two alkaline cells, blocking oscillator with a feedback winding, four-cell ladder, bleeder string; battery life matters.',
    members: [...CORE_TEAM, { email: 'field-engineer@northfold.test', role: 'engineer' }],
  },
];

/**
 * Creates the Northfold Instruments demo accounts, projects, memberships and designs that are missing.
 * Existing records are left as they are (passwords are not reset). Returns how many records it created.
 */
export async function seedDemo(hasher: PasswordHasherService): Promise<number> {
  let created = 0;
  const userIds = new Map<string, string>();
  const passwordHash = await hasher.hash(DEMO_PASSWORD);
  for (const demoUser of DEMO_USERS) {
    const [user, isNew] = await UserModel.findOrCreate({
      where: { email: demoUser.email },
      defaults: { ...demoUser, passwordHash },
    });
    userIds.set(demoUser.email, user.id);
    if (isNew) created += 1;
  }
  for (const demoProject of DEMO_PROJECTS) {
    const [project, isNew] = await ProjectModel.findOrCreate({
      where: { name: demoProject.name },
      defaults: { name: demoProject.name, productLine: demoProject.productLine, description: demoProject.description },
    });
    if (isNew) created += 1;
    for (const member of demoProject.members) {
      const userId = userIds.get(member.email);
      if (!userId) throw new Error(`demo member ${member.email} is not a demo user`);
      const [, isNewMember] = await ProjectMemberModel.findOrCreate({
        where: { projectId: project.id, userId },
        defaults: { projectId: project.id, userId, role: member.role },
      });
      if (isNewMember) created += 1;
    }
  }
  const sequelize = ProjectModel.sequelize;
  if (!sequelize) throw new Error('demo seed needs the database connection');
  // Parts first: the demo designs' reports are computed against their project's shelf.
  created += await seedDemoParts(DEMO_PROJECTS.map((project) => project.name));
  created += await seedDemoDesigns(sequelize);
  return created;
}
