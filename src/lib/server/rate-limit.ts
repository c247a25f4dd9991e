/**
 * Authentication limits: fixed windows counted in PostgreSQL (table auth_rate_limit), so that several web
 * servers share them. AUTH_RATE_LIMIT=off switches them off (the browser tests sign in many times from one address).
 */
import { eq, sql } from "drizzle-orm";
import { db } from "./db/client";
import { authRateLimit } from "./db/schema";
import { serverEnv } from "./env";

export interface LimitRule {
  /** Prefix of the counter's key. */
  name: string;
  max: number;
  windowSeconds: number;
}

/** The limits; per client address unless the name says per account. */
export const AUTH_LIMITS = {
  signIn: { name: "sign-in:ip", max: 20, windowSeconds: 10 * 60 },
  signInFailuresPerAccount: { name: "sign-in-failed:email", max: 5, windowSeconds: 15 * 60 },
  passwordReset: { name: "password-reset:ip", max: 5, windowSeconds: 15 * 60 },
  passwordResetPerAccount: { name: "password-reset:email", max: 3, windowSeconds: 15 * 60 },
  signUp: { name: "sign-up:ip", max: 10, windowSeconds: 60 * 60 },
} as const satisfies Record<string, LimitRule>;

export interface LimitResult {
  allowed: boolean;
  /** Seconds until the window ends (for Retry-After). */
  retryAfterSeconds: number;
  count: number;
}

export function rateLimitsEnabled(): boolean {
  return serverEnv().AUTH_RATE_LIMIT !== "off";
}

const keyOf = (rule: LimitRule, subject: string) => `${rule.name}:${subject.toLowerCase()}`;

function result(rule: LimitRule, count: number, windowStartedAt: Date): LimitResult {
  const ends = windowStartedAt.getTime() + rule.windowSeconds * 1000;
  return { allowed: count <= rule.max, count, retryAfterSeconds: Math.max(1, Math.ceil((ends - Date.now()) / 1000)) };
}

/** Counts one attempt (one atomic upsert; a window that has ended starts again at 1). */
export async function hit(rule: LimitRule, subject: string): Promise<LimitResult> {
  const expired = sql`${authRateLimit.windowStartedAt} <= now() - make_interval(secs => ${rule.windowSeconds})`;
  const [row] = await db
    .insert(authRateLimit)
    .values({ key: keyOf(rule, subject), count: 1, windowStartedAt: sql`now()` })
    .onConflictDoUpdate({
      target: authRateLimit.key,
      set: {
        count: sql`case when ${expired} then 1 else ${authRateLimit.count} + 1 end`,
        windowStartedAt: sql`case when ${expired} then now() else ${authRateLimit.windowStartedAt} end`,
      },
    })
    .returning({ count: authRateLimit.count, windowStartedAt: authRateLimit.windowStartedAt });
  return result(rule, row!.count, row!.windowStartedAt);
}

/** Whether the counter is already past its limit, without counting (for limits that count failures only). */
export async function peek(rule: LimitRule, subject: string): Promise<LimitResult> {
  const [row] = await db
    .select({ count: authRateLimit.count, windowStartedAt: authRateLimit.windowStartedAt })
    .from(authRateLimit)
    .where(
      sql`${authRateLimit.key} = ${keyOf(rule, subject)} and ${authRateLimit.windowStartedAt} > now() - make_interval(secs => ${rule.windowSeconds})`,
    );
  if (!row) return { allowed: true, count: 0, retryAfterSeconds: 0 };
  return { ...result(rule, row.count, row.windowStartedAt), allowed: row.count < rule.max };
}

export async function resetLimit(rule: LimitRule, subject: string): Promise<void> {
  await db.delete(authRateLimit).where(eq(authRateLimit.key, keyOf(rule, subject)));
}
