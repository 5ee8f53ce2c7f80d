import { randomUUID } from 'node:crypto';
import type { ProjectRole, SiteRole } from '../../shared/api/types';
import { demoModels } from '../../shared/demo';
import { hashPassword } from '../auth/passwords';
import type { SyncService } from '../services/SyncService';
import type { UserRow } from './entities';
import type { Transactor } from './Transactor';

/** The demo accounts; their passwords are documented in server/README.md. Invented people. */
export const DEMO_USERS: readonly { email: string; name: string; password: string; siteRole: SiteRole; projectRole: ProjectRole | null }[] = [
  { email: 'admin@gluefield.local', name: 'Site Admin', password: 'fieldbook-admin-1', siteRole: 'admin', projectRole: null },
  { email: 'ada@gluefield.local', name: 'Ada Lindqvist', password: 'fieldbook-ada-1', siteRole: 'member', projectRole: 'owner' },
  { email: 'ben@gluefield.local', name: 'Ben Okafor', password: 'fieldbook-ben-1', siteRole: 'member', projectRole: 'editor' },
  { email: 'cleo@gluefield.local', name: 'Cleo Marsh', password: 'fieldbook-cleo-1', siteRole: 'member', projectRole: 'viewer' },
];

export const DEMO_PROJECT_NAME = 'Ridge-line survey (demo)';
const SEEDED_KEY = 'demo-seeded';

/**
 * Create the demo accounts, one shared project with a crew of three, and
 * the demo models in it, once: a marker row records that it was done, so
 * a restart (or deleting the demo project) never seeds again.
 */
export async function seedDemo(tx: Transactor, sync: SyncService, bcryptRounds: number): Promise<boolean> {
  if (await tx.read((repos) => repos.meta.existsBy({ key: SEEDED_KEY }))) return false;
  const hashes = await Promise.all(DEMO_USERS.map((u) => hashPassword(u.password, bcryptRounds)));
  const seeded = await tx.write(async (repos) => {
    if (await repos.meta.existsBy({ key: SEEDED_KEY })) return null;
    const now = new Date().toISOString();
    const projectId = randomUUID();
    let owner: UserRow | null = null;
    await repos.projects.insert({ id: projectId, name: DEMO_PROJECT_NAME, revision: 0, createdBy: '', createdAt: now, updatedAt: now });
    for (const [i, demo] of DEMO_USERS.entries()) {
      const existing = await repos.users.findOneBy({ email: demo.email });
      const user: UserRow = existing ?? {
        id: randomUUID(), email: demo.email, name: demo.name, passwordHash: hashes[i], siteRole: demo.siteRole, disabled: false, createdAt: now, updatedAt: now,
      };
      if (!existing) await repos.users.insert(user);
      if (demo.projectRole) await repos.memberships.insert({ id: randomUUID(), projectId, userId: user.id, role: demo.projectRole, createdAt: now });
      if (demo.projectRole === 'owner') owner = user;
    }
    await repos.projects.update({ id: projectId }, { createdBy: owner!.id });
    await repos.meta.insert({ key: SEEDED_KEY, value: now });
    return { projectId, owner: owner! };
  });
  if (!seeded) return false;
  const changes = demoModels().map(({ key, model }) => ({
    changeId: `demo-seed-${key}`, docId: `demo-${key}`, kind: 'model' as const, baseVersion: 0, body: { name: model.name, model },
  }));
  await sync.push(seeded.owner, seeded.projectId, changes);
  return true;
}
