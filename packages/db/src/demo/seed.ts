// Seeds the demo scenario once: running it again finds the demo company and changes nothing.
// Runs as the owner role (which may write for several companies).
import { randomBytes } from 'node:crypto';
import { eq, inArray } from 'drizzle-orm';
import type { Db } from '../client.ts';
import {
  gameModels,
  games,
  memberships,
  technicianProfiles as technicianProfilesTable,
  tenantSettings,
  tenants,
  users,
  venueContacts,
  venues,
} from '../schema/index.ts';
import { seedCallHistory } from './call-history.ts';
import { seedBench } from './bench.ts';
import { seedCarePlans } from './care-plans.ts';
import { seedStock } from './stock.ts';
import { hashPassword } from '../passwords.ts';
import {
  DEMO_PASSWORD,
  demoCompany,
  demoModels,
  demoPeople,
  technicianProfiles,
  neighbourhoods,
  openingHoursFor,
  secondCompany,
  secondPeople,
  streets,
  venueName,
  contactName,
} from './scenario.ts';
import { seededRandom } from './random.ts';

const VENUES = 40;
const GAMES = 150;

// Tag tokens are random even in the demo: a token derived from anything in the source could be
// computed by anyone who reads it.
function demoToken(): string {
  return randomBytes(18).toString('base64url');
}

export async function seedDemo(db: Db): Promise<boolean> {
  const [exists] = await db.select({ id: tenants.id }).from(tenants).where(eq(tenants.id, demoCompany.id));
  if (exists) return false;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (tx) => {
    await tx.insert(tenants).values([demoCompany, secondCompany]);
    for (const [company, people] of [
      [demoCompany, demoPeople],
      [secondCompany, secondPeople],
    ] as const) {
      for (const p of people) {
        const [u] = await tx
          .insert(users)
          .values({ email: p.email, name: p.name, passwordHash, phone: p.phone, emailVerifiedAt: new Date() })
          .onConflictDoNothing()
          .returning({ id: users.id });
        const userId = u?.id ?? (await tx.select({ id: users.id }).from(users).where(eq(users.email, p.email)))[0]!.id;
        await tx.insert(memberships).values({ tenantId: company.id, userId, role: p.role });
        const profile = technicianProfiles[p.email];
        if (profile && company.id === demoCompany.id) {
          await tx
            .insert(technicianProfilesTable)
            .values({ tenantId: company.id, userId, skills: profile.skills, homeLatitude: profile.lat, homeLongitude: profile.lon });
        }
      }
    }
    // Ilse the technician also freelances for the second company: she switches between them.
    const [ilse] = await tx.select({ id: users.id }).from(users).where(eq(users.email, 'tech1@lakeshore.example'));
    await tx.insert(memberships).values({ tenantId: secondCompany.id, userId: ilse!.id, role: 'technician' });

    const rand = seededRandom(20261201);
    const jitter = () => (rand() - 0.5) * 0.02;
    const venueRows = await tx
      .insert(venues)
      .values(
        Array.from({ length: VENUES }, (_, i) => {
          const n = neighbourhoods[i % neighbourhoods.length]!;
          return {
            tenantId: demoCompany.id,
            name: venueName(i),
            addressLine: `${100 + Math.floor(rand() * 4800)} ${streets[(i * 5) % streets.length]}`,
            city: n.city,
            postcode: n.zip,
            latitude: Number((n.lat + jitter()).toFixed(5)),
            longitude: Number((n.lon + jitter()).toFixed(5)),
            openingHours: openingHoursFor(i),
            contactName: i === 0 ? 'Hollis Varga' : contactName(i),
            contactPhone: `+1 312 555 01${String(i).padStart(2, '0')}`,
            contactEmail: i === 0 ? 'venue@lakeshore.example' : '',
            notes: i % 5 === 0 ? 'Loading dock at the back; ring the bell.' : '',
            createdAt: new Date(Date.UTC(2019, i % 12, 1 + (i % 27))),
          };
        }),
      )
      .returning({ id: venues.id });
    // Labour at cost per hour on site (keep cost), and city driving between venues (route days).
    await tx
      .insert(tenantSettings)
      .values([
        { tenantId: demoCompany.id, dispatchPhone: '+13125550102', labourRateCents: 5200, averageSpeedKmh: 32 },
        { tenantId: secondCompany.id },
      ]);
    // Hollis speaks for the first venue.
    const [hollis] = await tx.select({ id: users.id }).from(users).where(eq(users.email, 'venue@lakeshore.example'));
    await tx.insert(venueContacts).values({ tenantId: demoCompany.id, venueId: venueRows[0]!.id, userId: hollis!.id });

    const modelRows = await tx
      .insert(gameModels)
      .values(demoModels.map((m) => ({ ...m, tenantId: demoCompany.id })))
      .returning({ id: gameModels.id, kind: gameModels.kind });
    const statuses = ['running', 'running', 'running', 'running', 'running', 'running', 'running', 'attention', 'down', 'in_shop'] as const;
    const gameRows = await tx
      .insert(games)
      .values(
        Array.from({ length: GAMES }, (_, i) => {
          const model = modelRows[Math.floor(rand() * modelRows.length)]!;
          const installed = new Date(Date.UTC(2019 + Math.floor(rand() * 6), Math.floor(rand() * 12), 1 + Math.floor(rand() * 27)));
          const status = statuses[Math.floor(rand() * statuses.length)]!;
          return {
            tenantId: demoCompany.id,
            modelId: model.id,
            venueId: status === 'in_shop' ? null : venueRows[i % VENUES]!.id,
            serial: `LT-${String(10000 + i * 37).padStart(6, '0')}`,
            status,
            installedOn: installed.toISOString().slice(0, 10),
            pricePerPlayCents: model.kind === 'pinball' ? (rand() < 0.5 ? 100 : 150) : model.kind === 'jukebox' ? 50 : 100,
            tagToken: demoToken(),
            createdAt: installed,
          };
        }),
      )
      .returning({ id: games.id, venueId: games.venueId, status: games.status, installedOn: games.installedOn });
    const techIds = await tx
      .select({ id: users.id })
      .from(users)
      .where(inArray(users.email, Object.keys(technicianProfiles)));
    // One moment for everything relative to now: the demo's today is the day it is seeded.
    const now = new Date();
    await seedCallHistory(tx, { tenantId: demoCompany.id, games: gameRows, technicianIds: techIds.map((t) => t.id), rand, now });
    await seedBench(tx, { tenantId: demoCompany.id, games: gameRows, technicianIds: techIds.map((t) => t.id) });
    // Care plans and their work orders (with the meters they read and the route days they fill), then parts and stock.
    const { doneWorkOrders } = await seedCarePlans(tx, { tenantId: demoCompany.id, now, rand: seededRandom(20261204) });
    await seedStock(tx, { tenantId: demoCompany.id, now, doneWorkOrders, rand: seededRandom(20261205) });

    // The second company: a few venues and games of its own.
    const [pv1, pv2, pv3] = await tx
      .insert(venues)
      .values([
        {
          tenantId: secondCompany.id,
          name: 'Gravel Road Roadhouse',
          addressLine: '77 Quill Ct',
          city: 'Naperville',
          postcode: '60540',
          latitude: 41.7508,
          longitude: -88.1535,
        },
        {
          tenantId: secondCompany.id,
          name: 'Silo Street Pins',
          addressLine: '412 Petrie St',
          city: 'Aurora',
          postcode: '60505',
          latitude: 41.7606,
          longitude: -88.3201,
        },
        {
          tenantId: secondCompany.id,
          name: 'Cornerstone Bowl',
          addressLine: '9 Osgood Pl',
          city: 'Joliet',
          postcode: '60432',
          latitude: 41.525,
          longitude: -88.0817,
        },
      ])
      .returning({ id: venues.id });
    const [pm] = await tx
      .insert(gameModels)
      .values({ tenantId: secondCompany.id, maker: 'Halloway Amusement', title: 'Comet Carnival', kind: 'pinball', year: 1992 })
      .returning({ id: gameModels.id });
    await tx.insert(games).values(
      [pv1, pv2, pv3, pv1, pv2].map((v, i) => ({
        tenantId: secondCompany.id,
        modelId: pm!.id,
        venueId: v!.id,
        serial: `PP-${900 + i}`,
        tagToken: demoToken(),
      })),
    );
  });
  return true;
}
