// The parts catalogue's workflow: add a part (part numbers are unique in the company, whatever their case), edit it
// at the version it was opened at, retire it (its history stays), and link it to the parts-list entries it fits.
import type { Tx } from '@bumperline/db/client';
import type { CataloguePartUpdate } from '@bumperline/contracts/parts-catalogue';
import {
  findBoardPartForFit,
  findCataloguePartByNumber,
  getCataloguePart,
  insertCataloguePart,
  linkPartFit,
  listFitsOfPart,
  unlinkPartFit,
  updateCataloguePart,
  type CataloguePartFields,
} from '@bumperline/db/queries/catalogue-parts';
import { listHoldingsOfPart } from '@bumperline/db/queries/stock-levels';
import { recordAudit } from '@bumperline/db/queries/audit';
import { Conflict, InvalidInput, NotFound } from './workflow-errors.ts';

const taken = () => new InvalidInput([{ field: 'partNumber', message: 'is already in the catalogue' }]);

async function partOrThrow(tx: Tx, id: string) {
  const part = await getCataloguePart(tx, id);
  if (!part) throw new NotFound('part');
  return part;
}

export async function createCataloguePart(tx: Tx, input: CataloguePartFields, actorUserId: string) {
  if (await findCataloguePartByNumber(tx, input.partNumber)) throw taken();
  const id = await insertCataloguePart(tx, input);
  // Another request took the number between the check and the insert: the unique index kept one.
  if (!id) throw taken();
  const part = await partOrThrow(tx, id);
  await recordAudit(tx, { actorUserId, action: 'create', entity: 'catalogue_part', entityId: id, after: part });
  return part;
}

export async function updateCataloguePartAtVersion(
  tx: Tx,
  id: string,
  input: Omit<CataloguePartUpdate, 'version'> & { version: number },
  actorUserId: string,
) {
  const { version, ...patch } = input as { version: number } & Partial<CataloguePartFields>;
  const before = await partOrThrow(tx, id);
  if (patch.partNumber !== undefined) {
    const other = await findCataloguePartByNumber(tx, patch.partNumber);
    if (other && other !== id) throw taken();
  }
  if (!(await updateCataloguePart(tx, id, version, patch))) {
    throw new Conflict('Someone else changed this part since you opened it. Review the current values and try again.', before, [
      { field: 'version', message: 'is not the part’s current version' },
    ]);
  }
  const after = await partOrThrow(tx, id);
  await recordAudit(tx, { actorUserId, action: 'update', entity: 'catalogue_part', entityId: id, before, after });
  return after;
}

/** Retiring keeps the part, its stock and its history; it only leaves the catalogue's lists and pickers. */
export async function retireCataloguePart(tx: Tx, id: string, actorUserId: string) {
  const before = await partOrThrow(tx, id);
  if (before.retiredAt) return before;
  await updateCataloguePart(tx, id, before.version, { retiredAt: new Date() });
  const after = await partOrThrow(tx, id);
  await recordAudit(tx, { actorUserId, action: 'retire', entity: 'catalogue_part', entityId: id, before, after });
  return after;
}

export async function cataloguePartDetail(tx: Tx, id: string) {
  const part = await partOrThrow(tx, id);
  const [holdings, fits] = [await listHoldingsOfPart(tx, id), await listFitsOfPart(tx, id)];
  return { part, holdings, fits };
}

export async function linkFit(tx: Tx, cataloguePartId: string, boardPartId: string) {
  await partOrThrow(tx, cataloguePartId);
  if (!(await findBoardPartForFit(tx, boardPartId))) {
    throw new InvalidInput([{ field: 'boardPartId', message: 'is not an entry of one of the company’s parts lists' }]);
  }
  await linkPartFit(tx, cataloguePartId, boardPartId);
  return { items: await listFitsOfPart(tx, cataloguePartId) };
}

export async function unlinkFit(tx: Tx, cataloguePartId: string, boardPartId: string) {
  await partOrThrow(tx, cataloguePartId);
  if (!(await unlinkPartFit(tx, cataloguePartId, boardPartId))) throw new NotFound('fit');
  return { items: await listFitsOfPart(tx, cataloguePartId) };
}
