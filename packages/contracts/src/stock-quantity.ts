// How a stock quantity is sent: a number, with at most three decimals (the columns' scale). Whether a fraction is
// allowed depends on the part's unit (`each` is counted in whole numbers): the service checks that against the part,
// with the domain's rule (packages/domain/src/stock/quantity-rules.ts).
import { z } from 'zod';

/** The largest quantity a stock column (numeric(14,3)) holds comfortably. */
export const MAX_STOCK_QUANTITY = 1_000_000_000;

const threeDecimals = (n: number) => Math.abs(Math.round(n * 1000) - n * 1000) < 1e-6;

const quantityNumber = () =>
  z
    .number({ error: 'must be a number' })
    .max(MAX_STOCK_QUANTITY, { error: `must be at most ${MAX_STOCK_QUANTITY}` })
    .refine(threeDecimals, { error: 'must have at most three decimals' });

/** A quantity that moves (received, transferred, used): more than nothing. */
export const movedQuantity = quantityNumber().positive({ error: 'must be more than 0' });
/** A quantity that can be nothing (a count, a reorder point). */
export const heldQuantity = quantityNumber().nonnegative({ error: 'must not be negative' });
