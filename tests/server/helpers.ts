import { eq } from "drizzle-orm";
import { auth } from "@/lib/server/auth";
import { db } from "@/lib/server/db/client";
import { user } from "@/lib/server/db/schema";
import { signUp } from "@/lib/server/services/accounts";

let n = 0;
/** A unique address per call (tests share one throwaway database). */
export const uniqueEmail = (tag: string) => `${tag}-${Date.now().toString(36)}-${++n}@test.example`;

/** Request headers carrying the session cookie that better-auth set. */
export function cookieHeaders(setCookie: Headers): Headers {
  const cookie = setCookie
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return new Headers({ cookie, origin: process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:4321" });
}

/**
 * A new organisation's owner, signed in. The address is marked confirmed directly in the database (the
 * confirmation link itself is tested in auth-hardening.test.ts).
 */
export async function newOwner(tag = "owner") {
  const email = uniqueEmail(tag);
  const password = "correct horse";
  const r = await signUp({ name: `Test ${tag}`, email, password, organizationName: `Firm ${tag} ${n}` });
  if (r.kind !== "pending-verification" || !r.userId || !r.organizationId) throw new Error("sign-up did not create the account");
  await db.update(user).set({ emailVerified: true }).where(eq(user.id, r.userId));
  const { headers } = await auth.api.signInEmail({ body: { email, password }, returnHeaders: true });
  return { userId: r.userId, organizationId: r.organizationId, email, password, headers: cookieHeaders(headers) };
}
