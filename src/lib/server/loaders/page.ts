/**
 * How a page turns a loader's refusal into its answer: a NotFoundError or ForbiddenError becomes
 * the branded not-found or forbidden content with the matching status and reason phrase; any other
 * error propagates (Astro answers 500).
 */
import type { RoleName } from "@/lib/auth/roles";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";

export interface Refusal {
  status: 403 | 404;
  statusText: "Forbidden" | "Not Found";
  /** The loader's sentence, e.g. "Your role (client) does not allow you to edit projects". */
  message: string;
  role: RoleName | null;
}

export type PageResult<V> = { view: V; refusal: null } | { view: null; refusal: Refusal };

/** The part of Astro.response a page may set. */
export interface PageResponse {
  status?: number;
  statusText?: string;
}

export function refusalOf(err: unknown): Refusal | null {
  if (err instanceof NotFoundError) return { status: 404, statusText: "Not Found", message: err.message, role: null };
  if (err instanceof ForbiddenError) return { status: 403, statusText: "Forbidden", message: err.message, role: err.role };
  return null;
}

/** Runs a loader; on refusal sets the response's status and reason phrase and returns the refusal. */
export async function loadPage<V>(response: PageResponse, load: () => Promise<V>): Promise<PageResult<V>> {
  try {
    return { view: await load(), refusal: null };
  } catch (err) {
    const refusal = refusalOf(err);
    if (!refusal) throw err;
    response.status = refusal.status;
    response.statusText = refusal.statusText;
    return { view: null, refusal };
  }
}
