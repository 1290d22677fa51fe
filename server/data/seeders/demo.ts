import type { Sequelize } from 'sequelize';
import type { Role } from '@/shared/schemas/auth';
import { hashPassword } from '@/server/domain/auth/passwords';
import { OrganizationModel, UserModel } from '../models';

/** Invented demo scenario. Every demo account uses this password. */
export const DEMO_PASSWORD = 'kenning-demo';

export const DEMO_ORGANIZATIONS = [
  {
    slug: 'harrowmere',
    name: 'Harrowmere Lookout Service',
    users: [
      { email: 'admin@demo.kenning.test', name: 'Mara Quillon', role: 'admin' },
      { email: 'planner@demo.kenning.test', name: 'Teodor Ashby', role: 'planner' },
      { email: 'reviewer@demo.kenning.test', name: 'Lin Okonkwo-Hale', role: 'reviewer' },
      { email: 'observer@demo.kenning.test', name: 'Sami Rookwood', role: 'observer' },
    ],
  },
  {
    slug: 'tallon-bay',
    name: 'Tallon Bay Coast Watch',
    users: [
      { email: 'admin@tallon.kenning.test', name: 'Orla Brennick', role: 'admin' },
      { email: 'planner@tallon.kenning.test', name: 'Joss Fenwright', role: 'planner' },
    ],
  },
] as const satisfies ReadonlyArray<{
  slug: string;
  name: string;
  users: ReadonlyArray<{ email: string; name: string; role: Role }>;
}>;

/** Seeds the demo organisations and users once; returns false when already seeded. */
export async function seedDemo(db: Sequelize): Promise<boolean> {
  if (await OrganizationModel.findOne({ where: { slug: DEMO_ORGANIZATIONS[0].slug } })) return false;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (transaction) => {
    for (const org of DEMO_ORGANIZATIONS) {
      const row = await OrganizationModel.create({ slug: org.slug, name: org.name }, { transaction });
      for (const u of org.users) {
        await UserModel.create(
          {
            ...u,
            organizationId: row.id,
            passwordHash,
            inviteTokenHash: null,
            inviteExpiresAt: null,
            lastSignInAt: null,
          },
          { transaction },
        );
      }
    }
  });
  return true;
}
