import type { Role } from '@shared/schemas';
import { hashPassword } from '../auth/passwords';
import { UserRecord } from '../users/user.model';
import { Workspace } from '../workspaces/workspace.model';
import { sequelize } from './sequelize';

/** Invented demo scenario (DEVELOPERS.md, "Demo data"): an outdoor-gear maker's product team, invented costs. */
export const DEMO_PASSWORD = 'packwright-demo';

interface SeedWorkspace {
  slug: string;
  name: string;
  currency: string;
  members: { email: string; name: string; role: Role }[];
}

export const DEMO_WORKSPACES: SeedWorkspace[] = [
  {
    slug: 'demo',
    name: 'Fellhollow Outdoor — pack team',
    currency: 'EUR',
    members: [
      { email: 'admin@demo.test', name: 'Ada Admin', role: 'admin' },
      { email: 'designer@demo.test', name: 'Dana Designer', role: 'designer' },
      { email: 'chemist@demo.test', name: 'Chen Chemist', role: 'chemist' },
      { email: 'reviewer@demo.test', name: 'Rui Reviewer', role: 'reviewer' },
    ],
  },
  {
    // A second, small workspace so isolation between workspaces can be seen and tested.
    slug: 'harbour',
    name: 'Harbourline Cold Chain',
    currency: 'GBP',
    members: [
      { email: 'admin@harbour.test', name: 'Hana Admin', role: 'admin' },
      { email: 'designer@harbour.test', name: 'Hugo Designer', role: 'designer' },
      { email: 'chemist@harbour.test', name: 'Hedda Chemist', role: 'chemist' },
    ],
  },
];

type SeedStep = (workspaces: Map<string, Workspace>) => Promise<void>;
const steps: SeedStep[] = [];

/** Features add their demo records here; every step must be idempotent. */
export function registerSeedStep(step: SeedStep): void {
  steps.push(step);
}

/** Seeds the demo idempotently: a second run finds every record and adds nothing. */
export async function seedDemo(): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const workspaces = new Map<string, Workspace>();
  await sequelize.transaction(async (transaction) => {
    for (const ws of DEMO_WORKSPACES) {
      const [workspace] = await Workspace.findOrCreate({
        where: { slug: ws.slug },
        defaults: { slug: ws.slug, name: ws.name, currency: ws.currency },
        transaction,
      });
      workspaces.set(ws.slug, workspace);
      for (const member of ws.members) {
        await UserRecord.findOrCreate({
          where: { email: member.email },
          defaults: { ...member, workspaceId: workspace.id, passwordHash },
          transaction,
        });
      }
    }
  });
  await import('./seed-steps');
  for (const step of steps) await step(workspaces);
}
