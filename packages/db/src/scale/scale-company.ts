// One operator company of the scale data: its people, venues, models, games, and years of service calls
// with their timelines, downtime, messages and audit rows, shaped like a real route (most faults fixed
// within a day, some waiting on parts or in the shop, a few hundred calls open at the largest company), and its
// bench (scale-bench.ts): boards and parts lists, the boards in the games, overhauls and bench jobs.
import { randomBytes } from 'node:crypto';
import { callStateGroups, defaultSeverity, type CallState, type ProblemKind, type Severity } from '@bumperline/contracts/calls';
import { openingHoursFor, streets } from '../demo/scenario.ts';
import { textArray } from './copy-table.ts';
import type { Dice } from './dice.ts';
import { CompanyBench } from './scale-bench.ts';
import { CompanyCare } from './scale-care.ts';
import { CompanyStock } from './scale-stock.ts';
import { companyName, metros, modelCatalogue, personName, skillsByKind, venueName, type ModelKind } from './scale-names.ts';
import type { ScaleTables } from './scale-tables.ts';

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;
const YEAR = 365 * DAY;
/** The schema's default response targets (minutes) and warning lead, which every scale company keeps. */
const RESPONSE_TARGETS: Record<Severity, number> = { down: 240, fault: 1440, cosmetic: 4320 };
const WARN_BEFORE_MINUTES = 30;
/** Calls per game and year: about 60,000 calls over three years for 3,000 games. */
const CALLS_PER_GAME_YEAR = 8.2;
/** Share of games with a call open now (a few hundred at the largest company). */
const OPEN_SHARE = 0.09;
/** Messages younger than this are still waiting for the outbox worker. */
const PENDING_WINDOW = 15 * MINUTE;

export interface CompanyPlan {
  /** 0 is the largest company. */
  index: number;
  games: number;
  venues: number;
  years: number;
}

export interface CompanyContext {
  tables: ScaleTables;
  dice: Dice;
  /** The bench's own draws (scale-bench.ts), so the rest of the data is the same with or without it. */
  benchDice: Dice;
  /** Care plans, meters, stock and keep cost draw their own too (scale-care.ts, scale-stock.ts). */
  careDice: Dice;
  now: number;
  passwordHash: string;
  /** Called after each game's calls, so held rows can be sent before they pile up. */
  afterGame(): Promise<void>;
}

interface Person {
  id: string;
  name: string;
  email: string;
  phone: string | null;
}

interface Venue {
  id: string;
  name: string;
  contacts: Person[];
}

interface Model {
  id: string;
  title: string;
  kind: ModelKind;
  year: number;
}

interface Step {
  kind: 'assigned' | 'accepted' | 'state' | 'note' | 'warned';
  at: number;
  from?: CallState;
  to?: CallState;
  actor: Person | null;
  label: string;
  detail: Record<string, unknown>;
}

interface Company {
  index: number;
  tenantId: string;
  area: string;
  owner: Person;
  dispatchers: Person[];
  technicians: Person[];
  dispatchPhone: string;
}

const problemWeights: Record<ProblemKind, number> = { dead: 14, no_credit: 22, ball_stuck: 18, no_sound: 12, display_out: 16, other: 18 };
const openStateWeights = { reported: 18, assigned: 20, on_the_way: 8, on_site: 8, waiting_parts: 22, at_shop: 10, fixed: 14 } as const;
/** How long an open call has sat in its current state, by state. */
const openStateAge: Record<keyof typeof openStateWeights, number> = {
  reported: 2 * HOUR,
  assigned: 3 * HOUR,
  on_the_way: 30 * MINUTE,
  on_site: HOUR,
  waiting_parts: 4 * DAY,
  at_shop: 6 * DAY,
  fixed: 8 * HOUR,
};
const notes = [
  'Replaced the coin mech.',
  'Flipper coil was open; swapped it.',
  'Cleaned the playfield and adjusted the tilt bob.',
  'Power supply caps swapped.',
  'Bill acceptor jammed with a folded note.',
  'Monitor chassis reseated.',
  'Ordered a new display board.',
];
const pad = (n: number, width: number) => String(n).padStart(width, '0');
const token = () => randomBytes(18).toString('base64url');
const callRef = (id: string) => `#${id.slice(0, 6).toUpperCase()}`;

/** Adds one company's rows to the tables; returns its id. */
export async function generateCompany(plan: CompanyPlan, ctx: CompanyContext): Promise<string> {
  const { tables: t, dice } = ctx;
  const metro = metros[plan.index % metros.length]!;
  const start = ctx.now - plan.years * YEAR;
  const founded = start - dice.int(30, 3 * 365) * DAY;
  const domain = `c${pad(plan.index + 1, 3)}.scale.example`;
  const tenantId = dice.uuid();
  t.tenants.add({
    id: tenantId,
    name: companyName(plan.index),
    time_zone: metro.timeZone,
    currency: 'USD',
    locale: 'en-US',
    created_at: new Date(founded),
  });

  // People. Numbers are in the 555-01xx range, which North American numbering keeps for fiction.
  let personNo = plan.index * 7;
  const person = (local: string, withPhone: boolean, role: string): Person => {
    const p: Person = {
      id: dice.uuid(),
      name: personName(personNo++),
      email: `${local}@${domain}`,
      phone: withPhone ? `+1${metro.area}55501${pad(personNo % 100, 2)}` : null,
    };
    const joined = new Date(founded + dice.int(0, 60) * DAY);
    t.users.add({
      id: p.id,
      email: p.email,
      name: p.name,
      password_hash: ctx.passwordHash,
      phone: p.phone,
      email_verified_at: joined,
      created_at: joined,
    });
    t.memberships.add({ tenant_id: tenantId, user_id: p.id, role, created_at: joined });
    return p;
  };
  const big = plan.games >= 200;
  const owner = person('owner', true, 'owner');
  const dispatchers = Array.from({ length: big ? Math.max(2, Math.round(plan.games / 750)) : plan.games > 20 ? 1 : 0 }, (_, i) =>
    person(`dispatch${i + 1}`, true, 'dispatcher'),
  );
  const technicians = Array.from({ length: big ? Math.round(plan.games / 120) : 1 + Math.floor(plan.games / 15) }, (_, i) =>
    person(`tech${pad(i + 1, 2)}`, true, 'technician'),
  );
  const kinds = Object.keys(skillsByKind) as ModelKind[];
  const technicianSkills = new Map<string, string[]>();
  for (const tech of technicians) {
    const skills = [...new Set([dice.pick(kinds), dice.pick(kinds)].flatMap((k) => skillsByKind[k]))];
    technicianSkills.set(tech.id, skills);
    t.technicianProfiles.add({
      tenant_id: tenantId,
      user_id: tech.id,
      skills: textArray(skills),
      home_latitude: Number((metro.lat + (dice.float() - 0.5) * 0.3).toFixed(5)),
      home_longitude: Number((metro.lon + (dice.float() - 0.5) * 0.4).toFixed(5)),
      active: true,
    });
  }
  const company: Company = {
    index: plan.index,
    tenantId,
    area: metro.area,
    owner,
    dispatchers,
    technicians,
    dispatchPhone: (dispatchers[0] ?? owner).phone!,
  };
  // Labour at cost and driving speed vary a little between companies (and metros).
  const labourRateCents = ctx.careDice.int(38, 62) * 100;
  const averageSpeedKmh = ctx.careDice.int(28, 45);
  t.tenantSettings.add({
    tenant_id: tenantId,
    response_targets: RESPONSE_TARGETS,
    warn_before_minutes: WARN_BEFORE_MINUTES,
    map_tile_url: '',
    dispatch_phone: company.dispatchPhone,
    labour_rate_cents: labourRateCents,
    average_speed_kmh: averageSpeedKmh,
  });
  for (let i = 0; i < (big ? 3 : dice.int(0, 1)); i++) {
    t.invitations.add({
      tenant_id: tenantId,
      id: dice.uuid(),
      email: `invited${i + 1}@${domain}`,
      role: i === 0 ? 'dispatcher' : 'technician',
      token_hash: dice.hex(64),
      invited_by: owner.id,
      created_at: new Date(ctx.now - (i + 1) * DAY),
      expires_at: new Date(ctx.now + (6 - i) * DAY),
      accepted_at: null,
      revoked_at: null,
    });
  }

  // Venues: a few retired ones keep their history but no games.
  const retiredVenues = Math.floor(plan.venues / 100);
  const venues: Venue[] = [];
  for (let v = 0; v < plan.venues; v++) {
    const id = dice.uuid();
    const created = Math.min(founded + dice.int(0, Math.floor((ctx.now - founded) / DAY) - 60) * DAY, ctx.now - 60 * DAY);
    const retired = v >= plan.venues - retiredVenues;
    const nameNo = v + plan.index * 37;
    t.venues.add({
      tenant_id: tenantId,
      id,
      name: venueName(nameNo),
      address_line: `${dice.int(100, 4900)} ${dice.pick(streets)}`,
      city: metro.city,
      postcode: `${metro.zip}${pad(dice.int(1, 99), 2)}`,
      latitude: Number((metro.lat + (dice.float() - 0.5) * 0.4).toFixed(5)),
      longitude: Number((metro.lon + (dice.float() - 0.5) * 0.5).toFixed(5)),
      opening_hours: openingHoursFor(v),
      contact_name: personName(nameNo * 3),
      contact_phone: `+1 ${metro.area} 555 01${pad(v % 100, 2)}`,
      contact_email: '',
      notes: v % 5 === 0 ? 'Loading dock at the back; ring the bell.' : '',
      version: 1,
      created_at: new Date(created),
      updated_at: new Date(created),
      retired_at: retired ? new Date(ctx.now - dice.int(10, 200) * DAY) : null,
    });
    audit(ctx, tenantId, owner, created, 'create', 'venue', id, { name: venueName(nameNo), city: metro.city });
    if (!retired) venues.push({ id, name: venueName(nameNo), contacts: [] });
  }
  // Venue contacts: people at the bar who report problems and hear when they are fixed.
  const contactCount = big ? Math.round(plan.venues / 4) : Math.min(venues.length, 1 + Math.floor(plan.games / 20));
  const step = Math.max(1, Math.floor(venues.length / Math.max(1, contactCount)));
  for (let i = 0; i < contactCount; i++) {
    const venue = venues[(i * step) % venues.length]!;
    const contact = person(`venue${pad(i + 1, 3)}`, false, 'venue_contact');
    venue.contacts.push(contact);
    t.venueContacts.add({ tenant_id: tenantId, venue_id: venue.id, user_id: contact.id });
  }

  const modelCount = big ? Math.min(40, modelCatalogue.length) : dice.int(3, 8);
  const firstModel = dice.int(0, modelCatalogue.length - 1);
  const models: Model[] = Array.from({ length: modelCount }, (_, i) => {
    const m = modelCatalogue[(firstModel + i) % modelCatalogue.length]!;
    const id = dice.uuid();
    t.gameModels.add({
      tenant_id: tenantId,
      id,
      maker: m.maker,
      title: m.title,
      kind: m.kind,
      year: m.year,
      created_at: new Date(founded),
    });
    audit(ctx, tenantId, owner, founded, 'create', 'game_model', id, { maker: m.maker, title: m.title });
    return { id, title: m.title, kind: m.kind, year: m.year };
  });
  const bench = new CompanyBench(
    { tables: t, dice: ctx.benchDice, now: ctx.now },
    { tenantId, start, technicians },
    models,
    plan.index === 0,
  );

  const stock = new CompanyStock(
    { tables: t, dice: ctx.careDice, now: ctx.now },
    { tenantId, start, technicians, labourRateCents },
    bench.partsListEntries(),
    plan.index === 0,
  );
  const care = new CompanyCare(
    { tables: t, dice: ctx.careDice, now: ctx.now },
    {
      tenantId,
      start,
      timeZone: metro.timeZone,
      technicians: technicians.map((tech) => ({ id: tech.id, skills: technicianSkills.get(tech.id)! })),
      dispatcherId: (dispatchers[0] ?? owner).id,
      largest: plan.index === 0,
    },
    models,
    stock,
  );

  const serialPrefix = String.fromCharCode(65 + (plan.index % 26), 65 + (Math.floor(plan.index / 26) % 26));
  for (let g = 0; g < plan.games; g++) {
    const model = dice.pick(models);
    // Every venue gets a game before any gets a second.
    const venue = g < venues.length ? venues[g]! : dice.pick(venues);
    const retired = dice.chance(0.01);
    const installed = dice.chance(0.75) ? start - dice.int(0, 5 * 365) * DAY : start + dice.float() * (ctx.now - start - 30 * DAY);
    const installedAt = Math.max(installed, founded);
    // The call open now (if any) decides the game's status, which is written before its calls.
    const openState = !retired && dice.chance(OPEN_SHARE) ? dice.weighted(openStateWeights) : undefined;
    const openProblem = dice.weighted(problemWeights);
    const openSeverity = severityFor(dice, openProblem);
    const status =
      openState === undefined || openState === 'fixed'
        ? 'running'
        : openState === 'at_shop'
          ? 'in_shop'
          : openSeverity === 'down'
            ? 'down'
            : 'attention';
    const gameId = dice.uuid();
    const retiredAt = retired ? ctx.now - dice.int(5, 300) * DAY : null;
    const price = model.kind === 'pinball' ? (dice.chance(0.5) ? 100 : 150) : model.kind === 'jukebox' ? 50 : 100;
    t.games.add({
      tenant_id: tenantId,
      id: gameId,
      model_id: model.id,
      venue_id: retired ? null : venue.id,
      serial: `${serialPrefix}-${pad(100000 + g * 7, 6)}`,
      status,
      installed_on: new Date(installedAt).toISOString().slice(0, 10),
      price_per_play_cents: price,
      tag_token: token(),
      notes: '',
      version: 1,
      created_at: new Date(installedAt),
      updated_at: new Date(installedAt),
      retired_at: retiredAt === null ? null : new Date(retiredAt),
    });
    const staff = dice.pick([owner, ...dispatchers]);
    audit(ctx, tenantId, staff, installedAt, 'create', 'game', gameId, { modelId: model.id, venueId: venue.id });
    if (dice.chance(0.25)) {
      const at = Math.max(installedAt, start) + dice.float() * (ctx.now - Math.max(installedAt, start));
      audit(ctx, tenantId, staff, at, 'update', 'game', gameId, { pricePerPlayCents: { from: price, to: price + 50 } });
    }

    // Years of calls, one failure after another; the open call (if any) comes last.
    const game = { id: gameId, title: model.title, venue };
    const open = openState ? plotOpenCall(ctx, company, openState, openSeverity) : undefined;
    const historyEnd = Math.min(retiredAt ?? ctx.now, open ? open.opened - DAY : ctx.now - 2 * DAY);
    const meanGap = YEAR / (CALLS_PER_GAME_YEAR * (0.5 + dice.float()));
    for (let at = Math.max(installedAt, start) + dice.exponential(meanGap); at < historyEnd;) {
      const problem = dice.weighted(problemWeights);
      const severity = severityFor(dice, problem);
      const until = dice.chance(0.04) ? 'cancelled' : 'closed';
      const steps = plotCall(dice, company, severity, until).map((s) => ({ ...s, at: s.at + at }));
      const call = writeCall(ctx, company, game, { opened: at, problem, severity, steps });
      if (call.fixedAt !== null && call.technicianId !== null)
        stock.callFixed({ id: call.id, gameId, technicianId: call.technicianId, problem, at: call.fixedAt });
      at = steps[steps.length - 1]!.at + dice.exponential(meanGap);
    }
    const openCallId = open
      ? writeCall(ctx, company, game, { opened: open.opened, problem: openProblem, severity: openSeverity, steps: open.steps }).id
      : undefined;
    if (!retired) {
      bench.fitGame({
        id: gameId,
        modelId: model.id,
        installedAt,
        openCall: openCallId && openState ? { id: openCallId, state: openState } : undefined,
      });
    }
    care.fitGame({ id: gameId, model, venueId: retired ? null : venue.id, installedAt, retiredAt });
    await ctx.afterGame();
  }
  bench.finish();
  care.finish();
  stock.finish();
  return tenantId;
}

function severityFor(dice: Dice, problem: ProblemKind): Severity {
  const usual = defaultSeverity[problem];
  return usual === 'fault' && dice.chance(0.15) ? 'cosmetic' : usual;
}

/** The steps of a call after it was opened (times from the opening), as far as `until`. */
function plotCall(dice: Dice, c: Company, severity: Severity, until: CallState): Step[] {
  const steps: Step[] = [];
  let at = 0;
  let state: CallState = 'reported';
  const dispatcher = dice.pick(c.dispatchers.length ? c.dispatchers : [c.owner]);
  const tech = dice.pick(c.technicians);
  const move = (after: number, to: CallState, actor: Person, detail: Record<string, unknown> = {}) => {
    at += after;
    steps.push({ kind: 'state', at, from: state, to, actor, label: actor.name, detail });
    state = to;
  };
  if (until === 'reported') return steps;
  const assign = () => {
    at += 2 * MINUTE + dice.exponential(20 * MINUTE);
    steps.push({
      kind: 'assigned',
      at,
      from: 'reported',
      to: 'assigned',
      actor: dispatcher,
      label: dispatcher.name,
      detail: { technicianId: tech.id, previousTechnicianId: null },
    });
    state = 'assigned';
  };
  if (until === 'cancelled') {
    if (dice.chance(0.5)) assign();
    move(dice.exponential(2 * HOUR), 'cancelled', dispatcher);
    return steps;
  }
  assign();
  if (dice.chance(0.75)) {
    at += MINUTE + dice.exponential(10 * MINUTE);
    steps.push({ kind: 'accepted', at, actor: tech, label: tech.name, detail: {} });
  }
  if (until === 'assigned') return steps;
  const response = dice.exponential(severity === 'down' ? 90 * MINUTE : severity === 'fault' ? 8 * HOUR : 36 * HOUR);
  if (until === 'on_the_way' || dice.chance(0.8)) {
    move(response, 'on_the_way', tech);
    if (until === 'on_the_way') return steps;
    move(10 * MINUTE + dice.exponential(20 * MINUTE), 'on_site', tech);
  } else {
    move(response + 15 * MINUTE, 'on_site', tech);
  }
  if (until === 'on_site') return steps;
  if (dice.chance(0.15)) {
    at += 5 * MINUTE + dice.exponential(20 * MINUTE);
    steps.push({ kind: 'note', at, actor: tech, label: tech.name, detail: { note: dice.pick(notes) } });
  }
  const route = until === 'waiting_parts' ? 'parts' : until === 'at_shop' ? 'shop' : dice.weighted({ parts: 12, shop: 3, plain: 85 });
  if (route === 'parts') {
    move(20 * MINUTE + dice.exponential(30 * MINUTE), 'waiting_parts', tech, { note: 'Part ordered.' });
    if (until === 'waiting_parts') return steps;
    move(DAY + dice.exponential(3 * DAY), 'on_site', tech);
    move(20 * MINUTE + dice.exponential(60 * MINUTE), 'fixed', tech);
  } else if (route === 'shop') {
    move(20 * MINUTE + dice.exponential(30 * MINUTE), 'at_shop', tech);
    if (until === 'at_shop') return steps;
    move(2 * DAY + dice.exponential(5 * DAY), 'fixed', tech);
  } else {
    move(20 * MINUTE + dice.exponential(60 * MINUTE), 'fixed', tech);
  }
  if (until === 'fixed') return steps;
  move(10 * MINUTE + dice.exponential(4 * HOUR), 'closed', dispatcher);
  return steps;
}

/** A call open now in `state`: its steps, moved so that the last happened a state-typical while ago. */
function plotOpenCall(ctx: CompanyContext, c: Company, state: keyof typeof openStateWeights, severity: Severity) {
  const steps = plotCall(ctx.dice, c, severity, state);
  const lastAt = steps.length ? steps[steps.length - 1]!.at : 0;
  const opened = ctx.now - MINUTE - ctx.dice.exponential(openStateAge[state]) - lastAt;
  return { opened, steps: steps.map((s) => ({ ...s, at: s.at + opened })) };
}

function writeCall(
  ctx: CompanyContext,
  c: Company,
  game: { id: string; title: string; venue: Venue },
  call: { opened: number; problem: ProblemKind; severity: Severity; steps: Step[] },
): { id: string; technicianId: string | null; fixedAt: number | null } {
  const { tables: t, dice } = ctx;
  const id = dice.uuid();
  const steps = [...call.steps];
  const source = dice.weighted({ game_tag: 55, staff: 35, venue_view: game.venue.contacts.length ? 10 : 0 });
  const reporterPhone = source === 'game_tag' && dice.chance(0.4) ? `+1${c.area}55501${pad(dice.int(0, 99), 2)}` : null;
  const opener =
    source === 'staff'
      ? dice.pick(c.dispatchers.length ? c.dispatchers : [c.owner])
      : source === 'venue_view'
        ? game.venue.contacts[0]!
        : null;
  const targetAt = call.opened + RESPONSE_TARGETS[call.severity] * MINUTE;

  // The warnings job texts dispatch shortly before the target of a call nobody has reached yet.
  const warnAt = targetAt - WARN_BEFORE_MINUTES * MINUTE;
  const arrived = steps.find((s) => s.to === 'on_site' || s.to === 'cancelled')?.at ?? Infinity;
  const warned = call.severity !== 'cosmetic' && warnAt > call.opened && warnAt < arrived && warnAt < ctx.now;
  if (warned) {
    steps.push({ kind: 'warned', at: warnAt, actor: null, label: 'system', detail: { minutesLeft: WARN_BEFORE_MINUTES } });
    steps.sort((a, b) => a.at - b.at);
  }

  const last = steps[steps.length - 1];
  const state: CallState = [...steps].reverse().find((s) => s.to)?.to ?? 'reported';
  const technicianId = (steps.find((s) => s.kind === 'assigned')?.detail.technicianId as string | undefined) ?? null;
  const fixedAt = steps.find((s) => s.to === 'fixed')?.at ?? null;
  const closedAt = state === 'closed' || state === 'cancelled' ? last!.at : null;
  t.serviceCalls.add({
    tenant_id: c.tenantId,
    id,
    game_id: game.id,
    venue_id: game.venue.id,
    problem: call.problem,
    severity: call.severity,
    state,
    source,
    note: source === 'staff' && dice.chance(0.3) ? 'Called in by the venue.' : '',
    reporter_phone: reporterPhone,
    reporter_sms_consent: reporterPhone !== null,
    technician_id: technicianId,
    accepted_at: dateOrNull(steps.find((s) => s.kind === 'accepted')?.at),
    created_by: source === 'staff' ? opener!.id : null,
    status_token: token(),
    opened_at: new Date(call.opened),
    target_at: new Date(targetAt),
    fixed_at: dateOrNull(fixedAt),
    closed_at: dateOrNull(closedAt),
    warned_at: warned ? new Date(warnAt) : null,
    version: 1 + steps.filter((s) => s.kind === 'assigned' || s.kind === 'accepted' || s.kind === 'state').length,
    updated_at: new Date(last?.at ?? call.opened),
  });

  // A quarter of game-tag reports come with a photo of the fault. Only the rows: no image file is written,
  // so these photos answer 404 (the benchmarks read lists and call pages, never the pictures).
  if (source === 'game_tag' && dice.chance(0.25)) {
    const photoId = dice.uuid();
    t.callPhotos.add({
      tenant_id: c.tenantId,
      id: photoId,
      call_id: id,
      storage_key: `scale/${photoId}.jpg`,
      thumb_key: `scale/${photoId}-thumb.jpg`,
      content_type: 'image/jpeg',
      bytes: dice.int(80_000, 400_000),
      width: 1600,
      height: 1200,
      uploaded_by: 'reporter',
      created_at: new Date(call.opened),
    });
  }

  const event = (
    at: number,
    kind: string,
    actor: Person | null,
    label: string,
    from: CallState | null,
    to: CallState | null,
    detail: object,
  ) =>
    t.callEvents.add({
      tenant_id: c.tenantId,
      id: dice.uuid(),
      call_id: id,
      at: new Date(at),
      actor_user_id: actor?.id ?? null,
      actor_label: label,
      kind,
      from_state: from,
      to_state: to,
      detail,
    });
  const facts = `${game.title} at ${game.venue.name}`;
  const message = (at: number, channel: 'sms' | 'email', to: string, subject: string, body: string) => {
    const age = ctx.now - at;
    const outcome = age < PENDING_WINDOW ? 'pending' : dice.chance(0.003) ? 'failed' : 'sent';
    t.outbox.add({
      tenant_id: c.tenantId,
      id: dice.uuid(),
      channel,
      to_address: to,
      subject,
      body,
      call_id: id,
      status: outcome,
      attempts: outcome === 'pending' ? 0 : outcome === 'failed' ? 5 : 1,
      next_attempt_at: new Date(at + (outcome === 'failed' ? 6 * HOUR : 0)),
      claimed_at: null,
      last_error: outcome === 'failed' ? 'The provider refused the number.' : null,
      provider_id: outcome === 'sent' ? (channel === 'sms' ? `SM${dice.hex(32)}` : `<${dice.hex(24)}@bumperline.example>`) : null,
      provider_status: outcome === 'sent' && channel === 'sms' ? 'delivered' : null,
      created_at: new Date(at),
      sent_at: outcome === 'sent' ? new Date(at + 2000 + dice.int(0, 8000)) : null,
    });
  };

  const openerLabel = source === 'game_tag' ? 'Reporter (game tag)' : opener!.name;
  event(call.opened, 'opened', opener, openerLabel, null, 'reported', { problem: call.problem, severity: call.severity, source });
  for (const contact of game.venue.contacts)
    message(call.opened, 'email', contact.email, `Service call opened: ${game.title}`, `${facts}: a technician is on it.`);
  for (const s of steps) {
    event(s.at, s.kind, s.actor, s.label, s.from ?? null, s.to ?? null, s.detail);
    if (s.kind === 'assigned' && s.actor) {
      const tech = c.technicians.find((p) => p.id === s.detail.technicianId);
      if (tech?.phone)
        message(s.at, 'sms', tech.phone, '', `Bumperline call ${callRef(id)}: ${facts}. Reply YES to accept or NO to decline.`);
    }
    if (s.kind === 'warned')
      message(s.at, 'sms', c.dispatchPhone, '', `Bumperline: call ${callRef(id)} (${facts}) is due in ${WARN_BEFORE_MINUTES} minutes.`);
    if (s.kind === 'state' && s.to && reporterPhone && (callStateGroups.reporterNotified as readonly CallState[]).includes(s.to)) {
      message(s.at, 'sms', reporterPhone, '', `${facts}: ${s.to.replaceAll('_', ' ')}. Reply STOP to opt out.`);
    }
    if (s.to === 'closed') {
      for (const contact of game.venue.contacts)
        message(s.at, 'email', contact.email, `Fixed: ${game.title}`, `${facts} is running again.`);
    }
  }

  // Downtime: a game down from the report until the fix; a game in the shop from the day it went there.
  const shopAt = steps.find((s) => s.to === 'at_shop')?.at;
  const downFrom = call.severity === 'down' ? call.opened : shopAt;
  if (downFrom !== undefined) {
    t.downtimeIntervals.add({
      tenant_id: c.tenantId,
      id: dice.uuid(),
      game_id: game.id,
      call_id: id,
      started_at: new Date(downFrom),
      ended_at: dateOrNull(fixedAt ?? (state === 'cancelled' ? closedAt : null)),
    });
  }
  return { id, technicianId, fixedAt };
}

function audit(
  ctx: CompanyContext,
  tenantId: string,
  actor: Person,
  at: number,
  action: string,
  entity: string,
  entityId: string,
  fields: object,
) {
  const changes =
    action === 'create'
      ? Object.fromEntries(Object.entries(fields).map(([k, v]) => [k, { from: null, to: v }]))
      : (fields as Record<string, unknown>);
  ctx.tables.auditLog.add({ tenant_id: tenantId, at: new Date(at), actor_user_id: actor.id, action, entity, entity_id: entityId, changes });
}

const dateOrNull = (ms: number | null | undefined) => (ms === null || ms === undefined ? null : new Date(ms));
