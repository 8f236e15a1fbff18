/**
 * Stock quantities. A part counted `each` (a fuse, a connector) moves in whole numbers; wire by the metre, solder by
 * the gram and cleaner by the millilitre move in decimals, to the thousandth (the columns' scale). Common practice:
 * stock is counted in the unit it is sold and fitted in.
 */
import { DomainError } from '../errors.ts';

export type StockUnitName = 'each' | 'm' | 'g' | 'ml';

/** Whole-number units: only `each`. */
export function isCountedEach(unit: StockUnitName): boolean {
  return unit === 'each';
}

/** The quantity as thousandths of the unit, when it has at most three decimals. */
function thousandths(quantity: number): number | null {
  const scaled = Math.round(quantity * 1000);
  return Math.abs(scaled - quantity * 1000) < 1e-6 ? scaled : null;
}

/**
 * Refuses a quantity the part cannot move in: not a finite number, negative, a fraction of a part counted each,
 * or more than three decimals. `allowZero` for a count (an empty shelf) — a move of nothing is refused.
 */
export function checkStockQuantity(unit: StockUnitName, quantity: number, field = 'quantity', allowZero = false): void {
  if (typeof quantity !== 'number' || !Number.isFinite(quantity)) {
    throw new DomainError('not-a-number', 'must be a number', field);
  }
  if (quantity < 0) {
    throw new DomainError(
      'negative',
      isCountedEach(unit) ? 'whole numbers only: this part is counted each' : 'must not be negative',
      field,
    );
  }
  if (quantity === 0 && !allowZero) throw new DomainError('out-of-range', 'must be more than 0', field);
  if (isCountedEach(unit) && !Number.isInteger(quantity)) {
    throw new DomainError('not-an-integer', 'whole numbers only: this part is counted each', field);
  }
  if (thousandths(quantity) === null) throw new DomainError('out-of-range', 'must have at most three decimals', field);
}

/** At or below its reorder point: on the list to order. No reorder point: never. */
export function isLow(quantity: number, reorderPoint: number | null): boolean {
  return reorderPoint !== null && quantity <= reorderPoint;
}

/**
 * How many to order for a low level: its reorder quantity, or, when none is set, enough to come back above the
 * reorder point (point − quantity + 1 for parts counted each; point − quantity for decimals, at least a thousandth).
 */
export function orderQuantity(unit: StockUnitName, quantity: number, reorderPoint: number, reorderQuantity: number | null): number {
  if (reorderQuantity !== null) return reorderQuantity;
  const gap = reorderPoint - quantity;
  if (isCountedEach(unit)) return Math.max(1, Math.floor(gap) + 1);
  return Math.max(0.001, Math.round(gap * 1000) / 1000);
}

/**
 * quantity × unit cost in whole cents, rounded half up (half a cent and above rounds away from zero: common practice
 * for a price line). Computed in thousandths as integers, so 0.1 m at 45 ¢ is 4.5 → 5 ¢ without binary noise.
 */
export function lineCostCents(quantity: number, unitCostCents: number): number {
  const q = thousandths(quantity);
  if (q === null || q < 0) throw new DomainError('out-of-range', 'must have at most three decimals', 'quantity');
  if (!Number.isSafeInteger(unitCostCents) || unitCostCents < 0) {
    throw new DomainError('not-an-integer', 'must be a whole number of cents', 'unitCostCents');
  }
  const exact = BigInt(q) * BigInt(unitCostCents);
  const cents = (exact + 500n) / 1000n;
  return Number(cents);
}
