// Bench-job templates and bench jobs against the real app and PostgreSQL: opening a job from a game and from a
// service call, saving the draft with optimistic concurrency, the caution rule, finishing (every reading judged
// again by the domain code; a refusal names each field and saves nothing), what finishing writes, the job sheet
// and the blank template sheet as PDF (their text read back), photos on steps, and another company's rows.
import sharp from 'sharp';
import { and, eq, sql } from 'drizzle-orm';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { benchJob, benchJobPage, benchTemplate, type BenchJob } from '@bumperline/contracts/bench-jobs';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { benchJobs, benchTemplates, boardInstances, boardParts, modelBoards } from '@bumperline/db/schema/index';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { createCompany } from '../support/factories.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';

let t: TestApp;
let company: FullCompany;
let owner: Agent;
let technician: Agent;
let close: () => Promise<void>;

/** Our test board's parts by designator → id. */
let part: Record<string, string>;
let boardId: string;
let boardInstanceId: string;
let templateId: string;
/** Another company's job and board. */
let foreign: { jobId: string; boardInstanceId: string; templateId: string };

const steps: BenchStep[] = [
  {
    key: 'unplug',
    title: 'Unplug and verify dead',
    instructions: 'Unplug the game.',
    record: 'check',
    partKinds: [],
    designators: [],
    cautions: ['mains'],
  },
  { key: 'fuses', title: 'Fuses', instructions: '', record: 'fuse', partKinds: ['fuse'], designators: [], cautions: [] },
  { key: 'diodes', title: 'Diodes and bridge', instructions: '', record: 'diode_set', partKinds: ['diode'], designators: [], cautions: [] },
  {
    key: 'recap',
    title: 'Recap',
    instructions: 'Replace every electrolytic.',
    record: 'parts_used',
    partKinds: ['electrolytic'],
    designators: [],
    cautions: ['hot_iron', 'solder_fumes', 'leaded_solder'],
  },
  {
    key: 'measure',
    title: 'Measure resistors',
    instructions: '',
    record: 'readings',
    partKinds: ['resistor'],
    designators: [],
    cautions: [],
  },
  { key: 'load', title: 'Load resistor power', instructions: '', record: 'power', partKinds: [], designators: ['R1'], cautions: [] },
];

function emptyDraft(): BenchJobDraft {
  const progress = () => ({ done: false, acknowledged: false, answer: null, note: '', readings: {}, diodes: {}, fuses: {}, power: {} });
  return { steps: Object.fromEntries(steps.map((s) => [s.key, progress()])), partsUsed: [] };
}

async function count(query: ReturnType<typeof sql>): Promise<number> {
  const r = await t.db.owner.execute(query);
  return (r.rows[0] as { n: number }).n;
}
const readingsOf = (jobId: string) => count(sql`select count(*)::int as n from part_readings where bench_job_id = ${jobId}`);

async function openJob(body: Record<string, unknown> = {}): Promise<BenchJob> {
  const res = await technician
    .post('/api/bench-jobs')
    .set(JSON_HEADERS)
    .send({ boardInstanceId, templateId, ...body })
    .expect(201);
  return benchJob.parse(res.body);
}

function saveDraft(jobId: string, version: number, draft: BenchJobDraft) {
  return technician.put(`/api/bench-jobs/${jobId}/draft`).set(JSON_HEADERS).send({ version, draft });
}

/** Saves the draft, then finishes at the saved version. */
async function saveAndFinish(jobId: string, draft: BenchJobDraft) {
  const saved = await saveDraft(jobId, 1, draft).expect(200);
  return technician.post(`/api/bench-jobs/${jobId}/finish`).set(JSON_HEADERS).send({ version: saved.body.version });
}

async function pdfText(bytes: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

const binary = (res: { body: unknown }) => res.body as Buffer;
const asBuffer = (req: ReturnType<Agent['get']>) =>
  req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  const full = await appWithFullCompany('Delta Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  technician = full.agents.technician;
  const { tenantId } = company;

  boardId = company.bench.modelBoardId;
  // The full company's board already has R1 (600 Ω ±10 %, 1/2 W) and F1 (T2.5A 250V); the rest is added here.
  const rows = await t.db.owner
    .insert(boardParts)
    .values([
      { tenantId, boardId, position: 3, designator: 'R2', kind: 'resistor', value: '100k', tolerance: '5%', rating: '1/4 W' },
      { tenantId, boardId, position: 4, designator: 'D1', kind: 'diode', value: '1N4004' },
      {
        tenantId,
        boardId,
        position: 5,
        designator: 'C1',
        kind: 'electrolytic',
        value: '1000µF',
        tolerance: '20%',
        rating: '35 V',
        ratedTemperatureC: 105,
        ratedLifeHours: 2000,
      },
    ])
    .returning({ id: boardParts.id, designator: boardParts.designator });
  const all = await t.db.owner
    .select({ id: boardParts.id, designator: boardParts.designator })
    .from(boardParts)
    .where(and(eq(boardParts.tenantId, tenantId), eq(boardParts.boardId, boardId)));
  part = Object.fromEntries([...all, ...rows].map((p) => [p.designator, p.id]));
  boardInstanceId = company.bench.boardInstanceId;

  const created = await owner
    .post('/api/bench-templates')
    .set(JSON_HEADERS)
    .send({ name: 'Supply overhaul', description: 'Test template', steps })
    .expect(201);
  templateId = benchTemplate.parse(created.body).id;

  // Another company with a board, a template and a job of its own.
  const other = await createCompany(t.db.owner, 'Epsilon Amusements', 1);
  const [otherBoard] = await t.db.owner
    .insert(modelBoards)
    .values({ tenantId: other.tenantId, modelId: other.modelId, name: 'Power supply' })
    .returning({ id: modelBoards.id });
  const [otherInstance] = await t.db.owner
    .insert(boardInstances)
    .values({ tenantId: other.tenantId, boardId: otherBoard!.id, gameId: other.gameIds[0]!, serial: 'X-1' })
    .returning({ id: boardInstances.id });
  const [otherTemplate] = await t.db.owner
    .insert(benchTemplates)
    .values({ tenantId: other.tenantId, name: 'Theirs', steps })
    .returning({ id: benchTemplates.id });
  const [otherJob] = await t.db.owner
    .insert(benchJobs)
    .values({
      tenantId: other.tenantId,
      boardInstanceId: otherInstance!.id,
      templateId: otherTemplate!.id,
      templateName: 'Theirs',
      steps,
      origin: 'game',
      draft: emptyDraft(),
    })
    .returning({ id: benchJobs.id });
  foreign = { jobId: otherJob!.id, boardInstanceId: otherInstance!.id, templateId: otherTemplate!.id };
});
afterAll(() => close());

describe('bench-job templates', () => {
  it('are listed, read and saved at their version', async () => {
    const list = await owner.get('/api/bench-templates').expect(200);
    expect(list.body.items.map((i: { name: string }) => i.name)).toContain('Supply overhaul');
    const one = benchTemplate.parse((await owner.get(`/api/bench-templates/${templateId}`).expect(200)).body);
    expect(one.steps.map((s) => s.key)).toEqual(steps.map((s) => s.key));

    const renamed = await owner
      .put(`/api/bench-templates/${templateId}`)
      .set(JSON_HEADERS)
      .send({ version: one.version, name: 'Supply overhaul', description: 'Edited', steps })
      .expect(200);
    expect(renamed.body.version).toBe(one.version + 1);
    const stale = await owner
      .put(`/api/bench-templates/${templateId}`)
      .set(JSON_HEADERS)
      .send({ version: one.version, name: 'Lost edit', description: '', steps })
      .expect(409);
    expect(stale.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);
    expect(stale.body.current.name).toBe('Supply overhaul');
  });

  it('refuse bad steps, naming the step field', async () => {
    const base = steps[4]!;
    const send = (bad: unknown[]) => owner.post('/api/bench-templates').set(JSON_HEADERS).send({ name: 'Bad', steps: bad }).expect(400);
    const fields = async (bad: unknown[]) => ((await send(bad)).body.errors as { field: string }[]).map((e) => e.field);

    expect(await fields([base, { ...base, title: 'Again' }])).toEqual(['steps.1.key']);
    expect(await fields([{ ...base, partKinds: [], designators: [] }])).toEqual(['steps.0.partKinds']);
    expect(await fields([{ ...base, title: '  ' }])).toEqual(['steps.0.title']);
    expect(await fields([{ ...base, cautions: ['sharp_edges'] }])).toEqual(['steps.0.cautions.0']);
    expect(await fields([{ ...base, partKinds: ['flux_capacitor'] }])).toEqual(['steps.0.partKinds.0']);
    expect(await fields([{ ...base, record: 'guess' }])).toEqual(['steps.0.record']);
    expect(await fields([{ ...base, key: 'Measure Resistors' }])).toEqual(['steps.0.key']);
    expect(await count(sql`select count(*)::int as n from bench_templates where name = 'Bad'`)).toBe(0);
  });

  it('print a blank sheet, with each part and its window when printed for a board', async () => {
    const blank = await asBuffer(owner.get(`/api/bench-templates/${templateId}/sheet.pdf`)).expect(200);
    expect(blank.headers['content-type']).toBe('application/pdf');
    const blankText = await pdfText(binary(blank));
    expect(blankText).toContain('Unplug and verify dead');
    expect(blankText).toContain('Mains voltage');

    const forBoard = await asBuffer(owner.get(`/api/bench-templates/${templateId}/sheet.pdf`).query({ boardId })).expect(200);
    const text = await pdfText(binary(forBoard));
    expect(text).toContain('540 Ω – 660 Ω');
    expect(text).toContain('95 kΩ – 105 kΩ');
    expect(text).toContain('T2.5A 250V');
  });
});

describe('opening a bench job', () => {
  it('from a game copies the template and lists the board’s parts with their ids', async () => {
    const job = await openJob();
    expect(job).toMatchObject({ origin: 'game', state: 'in_progress', templateName: 'Supply overhaul', version: 1, serviceCallId: null });
    expect(job.steps.map((s) => s.key)).toEqual(steps.map((s) => s.key));
    expect(Object.keys(job.draft.steps).sort()).toEqual(steps.map((s) => s.key).sort());
    expect(job.parts.find((p) => p.designator === 'R1')).toMatchObject({ id: part.R1, value: '600', tolerance: '10%' });
    expect(job.gameId).toBe(company.gameIds[0]);
    expect(job.openedBy).toBe('Delta Coin Technician');

    // The list says who opened each job by id, so the bench page can put the signed-in person's own first.
    const me = (await technician.get('/api/account/me').expect(200)).body as { user: { id: string } };
    const list = benchJobPage.parse((await technician.get('/api/bench-jobs').query({ state: 'in_progress' }).expect(200)).body);
    expect(list.items.find((i) => i.id === job.id)?.openedByUserId).toBe(me.user.id);
  });

  it('from a service call on the board’s game, and refuses a call on another game', async () => {
    const job = await openJob({ serviceCallId: company.downCallId });
    expect(job).toMatchObject({ origin: 'service_call', serviceCallId: company.downCallId });

    const refused = await technician
      .post('/api/bench-jobs')
      .set(JSON_HEADERS)
      .send({ boardInstanceId, templateId, serviceCallId: company.assignedCallId })
      .expect(400);
    expect(refused.body.errors.map((e: { field: string }) => e.field)).toEqual(['serviceCallId']);
  });

  it('treats another company’s board as unknown', async () => {
    await technician.post('/api/bench-jobs').set(JSON_HEADERS).send({ boardInstanceId: foreign.boardInstanceId, templateId }).expect(404);
    const theirTemplate = await technician
      .post('/api/bench-jobs')
      .set(JSON_HEADERS)
      .send({ boardInstanceId, templateId: foreign.templateId })
      .expect(400);
    expect(theirTemplate.body.errors.map((e: { field: string }) => e.field)).toEqual(['templateId']);
  });
});

describe('the draft', () => {
  it('keeps what was typed, and a save from a stale version is refused with the current version', async () => {
    const job = await openJob();
    const draft = emptyDraft();
    draft.steps.measure!.readings[part.R1!] = { text: '57', inCircuit: false };
    const first = await saveDraft(job.id, 1, draft).expect(200);
    expect(first.body.version).toBe(2);

    const other = emptyDraft();
    other.steps.measure!.readings[part.R1!] = { text: '999', inCircuit: true };
    const stale = await saveDraft(job.id, 1, other).expect(409);
    expect(stale.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);
    expect(stale.body.current.version).toBe(2);
    expect(stale.body.current.draft.steps.measure.readings[part.R1!]).toEqual({ text: '57', inCircuit: false });

    const now = benchJob.parse((await technician.get(`/api/bench-jobs/${job.id}`).expect(200)).body);
    expect(now.version).toBe(2);
    expect(now.draft.steps.measure!.readings[part.R1!]).toEqual({ text: '57', inCircuit: false });
  });

  it('refuses a step ticked done without its cautions acknowledged', async () => {
    const job = await openJob();
    const draft = emptyDraft();
    draft.steps.unplug = { ...draft.steps.unplug!, done: true, answer: 'yes', note: 'Meter checked on a live socket first' };
    const res = await saveDraft(job.id, 1, draft).expect(400);
    expect(res.body.errors).toEqual([{ field: 'steps.unplug.acknowledged', message: expect.stringMatching(/acknowledge/) }]);
    const now = benchJob.parse((await technician.get(`/api/bench-jobs/${job.id}`).expect(200)).body);
    expect(now.version).toBe(1);
    expect(now.draft.steps.unplug!.done).toBe(false);

    draft.steps.unplug!.acknowledged = true;
    await saveDraft(job.id, 1, draft).expect(200);
  });

  it('refuses a step the job does not have and a draft past its size', async () => {
    const job = await openJob();
    const draft = emptyDraft();
    draft.steps['made-up'] = draft.steps.unplug!;
    expect((await saveDraft(job.id, 1, draft).expect(400)).body.errors.map((e: { field: string }) => e.field)).toEqual(['steps.made-up']);

    const huge = emptyDraft();
    for (let i = 0; i < 1050; i++)
      huge.steps.measure!.readings[`${i}`.padStart(36, '0')] = { text: '4k7 4k7 4k7 4k7 4k7 4k7 4k7', inCircuit: false };
    expect((await saveDraft(job.id, 1, huge).expect(400)).body.errors.map((e: { field: string }) => e.field)).toEqual(['draft']);
  });
});

describe('finishing a bench job', () => {
  it('refuses a reading that is not one, naming the field; nothing is saved and the draft is kept', async () => {
    const job = await openJob();
    const draft = emptyDraft();
    draft.steps.measure!.readings[part.R1!] = { text: 'abc', inCircuit: false };
    draft.steps.measure!.readings[part.R2!] = { text: '10µF', inCircuit: false };
    const res = await saveAndFinish(job.id, draft);
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(
      [`steps.measure.readings.${part.R1}`, `steps.measure.readings.${part.R2}`].sort(),
    );
    expect(await readingsOf(job.id)).toBe(0);
    const now = benchJob.parse((await technician.get(`/api/bench-jobs/${job.id}`).expect(200)).body);
    expect(now.state).toBe('in_progress');
    expect(now.draft.steps.measure!.readings[part.R1!]!.text).toBe('abc');
  });

  it('refuses a fuse that does not match on a step ticked done, with the reason', async () => {
    const job = await openJob();
    const draft = emptyDraft();
    draft.steps.fuses = { ...draft.steps.fuses!, done: true, fuses: { [part.F1!]: { fitted: 'F2.5A 250V' } } };
    const res = await saveAndFinish(job.id, draft);
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([{ field: `steps.fuses.fuses.${part.F1}`, message: expect.stringMatching(/faster/) }]);
    expect(await readingsOf(job.id)).toBe(0);
  });

  it('a stale version is refused', async () => {
    const job = await openJob();
    await saveDraft(job.id, 1, emptyDraft()).expect(200);
    const res = await technician.post(`/api/bench-jobs/${job.id}/finish`).set(JSON_HEADERS).send({ version: 1 }).expect(409);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'version' })]);
  });

  it('records each reading with its verdict, window and deviation, the parts used and the recap', async () => {
    const job = await openJob();
    const draft = emptyDraft();
    draft.steps.unplug = { ...draft.steps.unplug!, done: true, acknowledged: true, answer: 'yes' };
    draft.steps.fuses = { ...draft.steps.fuses!, done: true, fuses: { [part.F1!]: { fitted: 'T2.5A 250V' } } };
    draft.steps.diodes = { ...draft.steps.diodes!, done: true, diodes: { [part.D1!]: { forward: '0.55', reverse: 'OL' } } };
    draft.steps.recap = { ...draft.steps.recap!, done: true, acknowledged: true };
    draft.steps.measure = {
      ...draft.steps.measure!,
      done: true,
      readings: { [part.R1!]: { text: '570', inCircuit: false }, [part.R2!]: { text: '112k', inCircuit: false } },
    };
    draft.steps.load = { ...draft.steps.load!, done: true, power: { [part.R1!]: { volts: '20 V' } } };
    draft.partsUsed = [
      { partId: part.C1!, description: '1000µF 35V 105°C electrolytic', quantity: 1 },
      { partId: null, description: 'Header pins, 0.156"', quantity: 9 },
    ];
    const res = await saveAndFinish(job.id, draft);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const finished = benchJob.parse(res.body);
    expect(finished).toMatchObject({ state: 'finished', finishedBy: 'Delta Coin Technician' });

    const r1 = finished.evaluation!.readings.find((r) => r.partId === part.R1)!;
    // 600 Ω ±10 %: 540–660 Ω; 570 Ω is 5 % low, inside.
    expect(r1).toMatchObject({
      verdict: 'pass',
      min: 540,
      max: 660,
      windowText: '540 Ω – 660 Ω',
      deviationPercent: -5,
      stepKey: 'measure',
    });
    // 100 kΩ ±5 %: 95–105 kΩ; 112 kΩ is 12 % high.
    expect(finished.evaluation!.readings.find((r) => r.partId === part.R2)).toMatchObject({ verdict: 'high', min: 95000, max: 105000 });
    expect(finished.evaluation!.readings.find((r) => r.partId === part.D1)).toMatchObject({ verdict: 'pass', measured: null });
    expect(finished.evaluation!.fuses).toEqual([expect.objectContaining({ partId: part.F1, accepted: true, specified: 'T2.5A 250V' })]);
    // 20 V across 600 Ω is 0.667 W: over the 0.25 W a 1/2 W part allows at 50 % derating.
    expect(finished.evaluation!.power).toEqual([expect.objectContaining({ partId: part.R1, undersized: true })]);

    const stored = await t.db.owner.execute(
      sql`select part_id, verdict, min, max, deviation_percent, measured_text, taken_by, board_instance_id from part_readings where bench_job_id = ${job.id} order by measured_text`,
    );
    expect(stored.rows).toHaveLength(3);
    expect(stored.rows).toContainEqual({
      part_id: part.R2,
      verdict: 'high',
      min: 95000,
      max: 105000,
      deviation_percent: 12,
      measured_text: '112k',
      taken_by: company.technician.id,
      board_instance_id: boardInstanceId,
    });
    const used = await t.db.owner.execute(
      sql`select part_id, description, quantity from bench_job_parts_used where job_id = ${job.id} order by quantity`,
    );
    expect(used.rows).toEqual([
      { part_id: part.C1, description: '1000µF 35V 105°C electrolytic', quantity: 1 },
      { part_id: null, description: 'Header pins, 0.156"', quantity: 9 },
    ]);
    const board = await t.db.owner.execute(sql`select last_recap_on::text as d from board_instances where id = ${boardInstanceId}`);
    expect((board.rows[0] as { d: string | null }).d).toMatch(/^\d{4}-\d{2}-\d{2}$/);

    // A finished job's record no longer changes.
    await saveDraft(job.id, finished.version, draft).expect(409);
    await technician.post(`/api/bench-jobs/${job.id}/finish`).set(JSON_HEADERS).send({ version: finished.version }).expect(409);

    // The job sheet names the out-of-tolerance part in words with its window.
    const sheet = await asBuffer(technician.get(`/api/bench-jobs/${job.id}/sheet.pdf`)).expect(200);
    expect(sheet.headers['content-type']).toBe('application/pdf');
    const text = await pdfText(binary(sheet));
    expect(text).toMatch(/R2: 112 kΩ — OUT OF TOLERANCE — HIGH \(allowed 95 kΩ – 105 kΩ\)/);
    expect(text).toContain('540 Ω – 660 Ω');
    expect(text).toContain('UNDERSIZED');
    expect(text).toContain('Mains voltage — ✓ cautions acknowledged');
    expect(text).toContain('Header pins');

    const list = benchJobPage.parse((await technician.get('/api/bench-jobs').query({ state: 'finished' }).expect(200)).body);
    expect(list.items.map((i) => i.id)).toContain(job.id);
    expect(list.items.every((i) => i.state === 'finished')).toBe(true);
    const open = benchJobPage.parse(
      (await technician.get('/api/bench-jobs').query({ state: 'in_progress', boardInstanceId }).expect(200)).body,
    );
    expect(open.items.map((i) => i.id)).not.toContain(job.id);
    expect(open.items.every((i) => i.boardInstanceId === boardInstanceId && i.state === 'in_progress')).toBe(true);
  });
});

describe('photos on steps', () => {
  it('are taken in like a report’s photos and served to the company only', async () => {
    const job = await openJob();
    const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#a97' } })
      .png()
      .toBuffer();
    const sent = await technician
      .post(`/api/bench-jobs/${job.id}/photos`)
      .set(JSON_HEADERS)
      .field('stepKey', 'measure')
      .attach('photo', png, { filename: 'board.png', contentType: 'image/png' })
      .expect(201);
    const photo = sent.body.photo as { id: string; url: string; thumbUrl: string; stepKey: string };
    expect(photo.stepKey).toBe('measure');
    const full = await technician.get(photo.url).expect(200);
    expect(full.headers['content-type']).toBe('image/jpeg');
    const thumb = await technician.get(photo.thumbUrl).expect(200);
    expect(thumb.headers['content-type']).toBe('image/webp');
    const again = benchJob.parse((await technician.get(`/api/bench-jobs/${job.id}`).expect(200)).body);
    expect(again.photos.map((p) => p.id)).toEqual([photo.id]);

    const notImage = await technician
      .post(`/api/bench-jobs/${job.id}/photos`)
      .set(JSON_HEADERS)
      .field('stepKey', 'measure')
      .attach('photo', Buffer.from('just some text, not a picture'), { filename: 'board.jpg', contentType: 'image/jpeg' })
      .expect(400);
    expect(notImage.body.errors.map((e: { field: string }) => e.field)).toEqual(['photo']);
    const noStep = await technician
      .post(`/api/bench-jobs/${job.id}/photos`)
      .set(JSON_HEADERS)
      .field('stepKey', 'nowhere')
      .attach('photo', png, { filename: 'board.png', contentType: 'image/png' })
      .expect(400);
    expect(noStep.body.errors.map((e: { field: string }) => e.field)).toEqual(['stepKey']);
    expect(await count(sql`select count(*)::int as n from bench_job_photos where job_id = ${job.id}`)).toBe(1);
  });
});

describe('another company’s job', () => {
  it('is not found, whatever is asked of it', async () => {
    const id = foreign.jobId;
    await technician.get(`/api/bench-jobs/${id}`).expect(404);
    await saveDraft(id, 1, emptyDraft()).expect(404);
    await technician.post(`/api/bench-jobs/${id}/finish`).set(JSON_HEADERS).send({ version: 1 }).expect(404);
    await technician.get(`/api/bench-jobs/${id}/sheet.pdf`).expect(404);
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } })
      .png()
      .toBuffer();
    await technician
      .post(`/api/bench-jobs/${id}/photos`)
      .set(JSON_HEADERS)
      .field('stepKey', 'measure')
      .attach('photo', png, { filename: 'x.png', contentType: 'image/png' })
      .expect(404);
    const list = benchJobPage.parse((await technician.get('/api/bench-jobs').expect(200)).body);
    expect(list.items.map((i) => i.id)).not.toContain(id);
    await owner.get(`/api/bench-templates/${foreign.templateId}`).expect(404);
  });
});
