// Test factories: rows arranged as the owner role (which may write across companies), with overrides.
import { randomBytes, randomUUID } from 'node:crypto';
import type { Db } from '@bumperline/db/client';
import { gameModels, games, memberships, tenants, users, venues } from '@bumperline/db/schema/index';
import { hashPassword } from '@bumperline/db/passwords';
import { roles, type Role } from '@bumperline/contracts/roles';

export interface CompanyFixture {
  tenantId: string;
  ownerId: string;
  ownerEmail: string;
  venueIds: string[];
  gameIds: string[];
  modelId: string;
}

export type MemberRole = (typeof memberships.$inferInsert)['role'];

export const TEST_PASSWORD = 'correct horse battery staple';

export async function createUser(db: Db, overrides: Partial<typeof users.$inferInsert> = {}) {
  const [u] = await db
    .insert(users)
    .values({
      email: `user-${randomBytes(4).toString('hex')}@example.test`,
      name: 'Test Person',
      passwordHash: await hashPassword(TEST_PASSWORD),
      // Proven by default; pass `emailVerifiedAt: null` for an address nobody has confirmed.
      emailVerifiedAt: new Date(),
      ...overrides,
    })
    .returning();
  return u!;
}

export async function createCompany(db: Db, name: string, venueCount = 2): Promise<CompanyFixture> {
  const tenantId = randomUUID();
  await db.insert(tenants).values({ id: tenantId, name, timeZone: 'America/Chicago', currency: 'USD' });
  const owner = await createUser(db, { name: `${name} Owner` });
  await db.insert(memberships).values({ tenantId, userId: owner.id, role: 'owner' });
  const [model] = await db
    .insert(gameModels)
    .values({ tenantId, maker: 'Testworks', title: `${name} Flipper`, kind: 'pinball', year: 1994 })
    .returning();
  const venueRows = await db
    .insert(venues)
    .values(
      Array.from({ length: venueCount }, (_, i) => ({
        tenantId,
        name: `${name} Venue ${i + 1}`,
        addressLine: `${i + 1} Test Street`,
        city: 'Testville',
        latitude: 41.88 + i / 100,
        longitude: -87.63 - i / 100,
      })),
    )
    .returning();
  const gameRows = await db
    .insert(games)
    .values(
      venueRows.map((v, i) => ({
        tenantId,
        modelId: model!.id,
        venueId: v.id,
        serial: `SN-${i + 1}`,
        tagToken: randomBytes(16).toString('base64url'),
      })),
    )
    .returning();
  return {
    tenantId,
    ownerId: owner.id,
    ownerEmail: owner.email,
    venueIds: venueRows.map((v) => v.id),
    gameIds: gameRows.map((g) => g.id),
    modelId: model!.id,
  };
}

/** A new person (createUser's overrides apply) who belongs to the company with this role. */
export async function createMember(db: Db, tenantId: string, role: MemberRole, overrides: Partial<typeof users.$inferInsert> = {}) {
  const user = await createUser(db, overrides);
  await db.insert(memberships).values({ tenantId, userId: user.id, role });
  return user;
}

/**
 * A company (createCompany) with one person in every role: its owner, and for each other role a person at
 * `<role>@<company name as a slug>.test`. `people` holds each role's e-mail address (the password is TEST_PASSWORD).
 */
export async function companyWithEveryRole(
  db: Db,
  name: string,
  venueCount = 2,
): Promise<{ company: CompanyFixture; people: Record<Role, string> }> {
  const company = await createCompany(db, name, venueCount);
  const domain = `${name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.test`;
  const people = { owner: company.ownerEmail } as Record<Role, string>;
  for (const role of roles.filter((r) => r !== 'owner')) {
    people[role] = (await createMember(db, company.tenantId, role, { email: `${role}@${domain}` })).email;
  }
  return { company, people };
}
