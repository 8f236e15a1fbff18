// Bench-job templates: the list, one template, saving one (its steps checked by the contract), and its blank
// sheet for the bench as PDF. Thin: parse, call the queries, record the audit, return.
import { Router } from 'express';
import { benchTemplateInput, benchTemplateSheetQuery, benchTemplateUpdate, type BenchTemplate } from '@bumperline/contracts/bench-jobs';
import { recordAudit } from '@bumperline/db/queries/audit';
import {
  getBenchTemplate,
  insertBenchTemplate,
  listBenchTemplates,
  updateBenchTemplate,
  type BenchTemplateRow,
} from '@bumperline/db/queries/bench-templates';
import { listBoardParts } from '@bumperline/db/queries/board-parts';
import { getModelBoard } from '@bumperline/db/queries/model-boards';
import type { Tx } from '@bumperline/db/client';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import { templateSheetPdf } from '../services/bench-template-sheet.ts';
import { pdfFileName } from '../services/pdf-sheet.ts';

const view = (t: Omit<BenchTemplateRow, 'tenantId'>): BenchTemplate => ({
  ...t,
  createdAt: t.createdAt.toISOString(),
  updatedAt: t.updatedAt.toISOString(),
});

async function templateOrThrow(tx: Tx, id: string): Promise<BenchTemplate> {
  const row = await getBenchTemplate(tx, id);
  if (!row) throw new NotFoundError('bench-job template');
  return view(row);
}

export function benchTemplatesRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('bench:read', async ({ tx }) => ({
      items: (await listBenchTemplates(tx)).map((t) => ({ ...t, updatedAt: t.updatedAt.toISOString() })),
    })),
  );

  r.post(
    '/',
    scoped(
      'bench-templates:write',
      async ({ tx, req, actor }) => {
        const input = parse(benchTemplateInput, req.body);
        const id = await insertBenchTemplate(tx, input);
        const template = await templateOrThrow(tx, id);
        await recordAudit(tx, { actorUserId: actor.userId, action: 'create', entity: 'bench_template', entityId: id, after: template });
        return template;
      },
      201,
    ),
  );

  r.get(
    '/:id',
    scoped('bench:read', ({ tx, req }) => templateOrThrow(tx, idParam(req))),
  );

  r.put(
    '/:id',
    scoped('bench-templates:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const { version, ...fields } = parse(benchTemplateUpdate, req.body);
      const before = await templateOrThrow(tx, id);
      if ((await updateBenchTemplate(tx, id, version, fields)) === undefined) {
        throw new ConflictError('Someone else changed this template since you opened it. Review it and save again.', before, [
          { field: 'version', message: `is ${version}, but the template is now at version ${before.version}` },
        ]);
      }
      const after = await templateOrThrow(tx, id);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'update', entity: 'bench_template', entityId: id, before, after });
      return after;
    }),
  );

  r.get(
    '/:id/sheet.pdf',
    scoped('bench:read', async ({ tx, req, res }) => {
      const template = await templateOrThrow(tx, idParam(req));
      const { boardId } = parse(benchTemplateSheetQuery, req.query);
      let board;
      if (boardId) {
        const found = await getModelBoard(tx, boardId);
        if (!found) throw new ValidationError([{ field: 'boardId', message: 'is not a board of this company' }]);
        board = { name: found.name, partNumber: found.partNumber, parts: await listBoardParts(tx, boardId) };
      }
      const pdf = await templateSheetPdf({ ...template, board });
      res
        .status(200)
        .type('application/pdf')
        .set('Content-Disposition', `inline; filename="${pdfFileName(template.name)}.pdf"`)
        .set('Cache-Control', 'no-store')
        .send(pdf);
      return undefined;
    }),
  );

  return r;
}
