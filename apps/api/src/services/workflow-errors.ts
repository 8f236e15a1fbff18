// What a workflow (a service) can refuse, in its own words. Services know nothing of HTTP; the one error
// handler (http/problem-details.ts) turns these into problem details with the matching status.

/** A named thing does not exist in this company (or no longer can be acted on). */
export class NotFound extends Error {
  constructor(readonly what: string) {
    super(`No such ${what}.`);
    this.name = 'NotFound';
  }
}

/** The request is understood, but a field names something that cannot be used here. */
export class InvalidInput extends Error {
  constructor(readonly fields: { field: string; message: string }[]) {
    super(fields.map((f) => `${f.field} ${f.message}`).join('; '));
    this.name = 'InvalidInput';
  }
}

/** This person's role or relation to the thing does not allow the step. */
export class NotAllowed extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'NotAllowed';
  }
}

/** The thing changed under the request (a newer version, or a state that forbids the step); `current` is how it stands now,
 * `fields` the request's fields it concerns (a stale `version`). */
export class Conflict extends Error {
  constructor(
    message: string,
    readonly current?: unknown,
    readonly fields?: { field: string; message: string }[],
  ) {
    super(message);
    this.name = 'Conflict';
  }
}
