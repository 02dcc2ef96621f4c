/**
 * Refusals raised below the edge (lib/data, lib/reports): each says what kind of refusal it is and
 * carries a message a person understands. lib/http maps the kind to an HTTP status and a server
 * action to `{ ok: false, message }`; nothing below the edge knows about HTTP.
 */
export type RefusalKind =
  'invalid' | 'forbidden' | 'not-found' | 'conflict' | 'too-large' | 'unsupported-type' | 'too-many' | 'unavailable';

export class DomainError extends Error {
  constructor(
    public readonly kind: RefusalKind,
    message: string,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** The input is understood but a rule refuses it (422 at the edge). */
export class InvalidError extends DomainError {
  constructor(message: string) {
    super('invalid', message);
  }
}

/** The signed-in user may not do this to this record (403). */
export class ForbiddenError extends DomainError {
  constructor(message: string) {
    super('forbidden', message);
  }
}

/** No such record, or not one this user may see: both answer the same (404). */
export class NotFoundError extends DomainError {
  constructor(message: string) {
    super('not-found', message);
  }
}

/** The record's current state does not allow the change (409). */
export class ConflictError extends DomainError {
  constructor(message: string) {
    super('conflict', message);
  }
}

/** Too many requests of this kind from this address or e-mail in a short time (429). */
export class TooManyError extends DomainError {
  constructor(message: string) {
    super('too-many', message);
  }
}
