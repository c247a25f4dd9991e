/** Typed fetch for islands: JSON in, JSON out, problem+json errors turned into ApiError. */
import type { FieldError, Problem } from "@/lib/contracts/problem";

export type { FieldError };

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly errors: FieldError[] = [],
  ) {
    super(message);
  }
}

export async function api<T = unknown>(method: string, path: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, {
      method,
      headers: body === undefined ? {} : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: "same-origin",
    });
  } catch {
    throw new ApiError(0, "Cannot reach the Paneray server; check your connection and try again.");
  }
  if (res.status === 204) return undefined as T;
  const data = (await res.json().catch(() => null)) as (T & Partial<Problem>) | null;
  if (!res.ok) throw new ApiError(res.status, data?.detail ?? `Request failed (${res.status})`, data?.errors ?? []);
  return data as T;
}
