// Test factories: rows arranged as the owner role (which may write across companies), with overrides.
import { randomBytes, randomUUID } from 'node:crypto';
import type { Db } from '@bumperline/db/client';
import { gameModels, games, memberships, tenants, users, venues } from '@bumperline/db/schema/index';
import { hashPassword } from '@bumperline/db/passwords';

export interface CompanyFixture {
  tenantId: string;
  ownerId: string;
  ownerEmail: string;
  venueIds: string[];
  gameIds: string[];
  modelId: string;
}

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
