/**
 * Domain errors: what services and loaders throw when a request cannot be carried out. They know
 * nothing of HTTP; the endpoint factory (lib/server/http.ts) and the page loaders decide how each
 * one is answered.
 */
import type { FieldError } from "@/lib/contracts/problem";
import type { RoleName } from "@/lib/auth/roles";

export abstract class DomainError extends Error {
  /** Field-level details for forms (problem+json `errors`). */
  readonly errors: FieldError[];
  constructor(message: string, errors: FieldError[] = []) {
    super(message);
    this.name = new.target.name;
    this.errors = errors;
  }
}

/** The thing does not exist, or the caller may not know that it exists. */
export class NotFoundError extends DomainError {}

/** The caller sees the thing but may not do this to it. */
export class ForbiddenError extends DomainError {
  constructor(
    message: string,
    /** The caller's role, when the refusal comes from it. */
    readonly role: RoleName | null = null,
  ) {
    super(message);
  }

  /** A refusal that names the caller's role and what it does not allow. */
  static forRole(role: RoleName, action: string): ForbiddenError {
    return new ForbiddenError(`Your role (${role}) does not allow you to ${action}`, role);
  }
}

/** The request clashes with what is already stored (a duplicate, a used invitation, the last owner). */
export class ConflictError extends DomainError {}

/** The input is well-formed but not acceptable; `field` names the input in the request. */
export class InvalidError extends DomainError {
  constructor(
    readonly field: string,
    /** Short reason shown next to the field. */
    fieldMessage: string,
    /** The sentence for the whole request; defaults to the field's reason. */
    message: string = fieldMessage,
  ) {
    super(message, [{ field, message: fieldMessage }]);
  }
}

/** A limit on how often something may be done has been reached; it may be tried again after `retryAfterSeconds`. */
export class RateLimitedError extends DomainError {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(message);
  }
}

export const fieldError = (field: string, message: string): FieldError => ({ field, message });
