// Words and closed sets of parts and stock. No zod here: the technician's van-stock screen imports them.

/** Where stock is kept: a warehouse (or the shop's shelves) or one technician's van. */
export const stockLocationKinds = ['warehouse', 'van'] as const;
export type StockLocationKind = (typeof stockLocationKinds)[number];

/**
 * The unit a catalogue part is stocked in. `each` is countable: its quantities are whole numbers. The others
 * (wire by the metre, solder by the gram, cleaner by the millilitre) may take up to three decimals.
 */
export const stockUnits = ['each', 'm', 'g', 'ml'] as const;
export type StockUnit = (typeof stockUnits)[number];

export const stockUnitLabels: Record<StockUnit, string> = { each: 'each', m: 'm', g: 'g', ml: 'ml' };

/** Why stock moved: received from a supplier, moved between stocks, used on a job, or set by a count. */
export const stockMovementReasons = ['received', 'transfer', 'used', 'counted'] as const;
export type StockMovementReason = (typeof stockMovementReasons)[number];

export const stockMovementReasonLabels: Record<StockMovementReason, string> = {
  received: 'Received',
  transfer: 'Transfer',
  used: 'Used on a job',
  counted: 'Counted',
};

/** The jobs whose parts and labour make up a game's keep cost. */
export const keepCostSources = ['service_call', 'work_order', 'bench_job'] as const;
export type KeepCostSource = (typeof keepCostSources)[number];
