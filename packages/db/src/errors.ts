// Errors the database layer throws for the API to map to a response.

/** A list cursor that this API did not issue (or that no longer fits its sort key): a bad request, not a fault. */
export class InvalidCursorError extends Error {
  constructor() {
    super('cursor is not one this API issued');
  }
}
