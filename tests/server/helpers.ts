import { eq } from "drizzle-orm";
import { auth } from "@/lib/server/auth";
import { db } from "@/lib/server/db/client";
import { invitation, user } from "@/lib/server/db/schema";
import { signUp } from "@/lib/server/services/accounts";
import { inviteMember } from "@/lib/server/services/members";
import type { APIRoute } from "astro";

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

/** A signed-in caller as the endpoints see it in `locals.user`. */
export interface RouteCaller {
  id: string;
  name: string;
  email: string;
}

/** Calls an endpoint module's handler directly as `caller`; the body is parsed unless the answer is 204. */
export async function callRoute(
  route: APIRoute,
  caller: RouteCaller,
  path: string,
  params: Record<string, string>,
  init: { method?: string; body?: unknown } = {},
): Promise<{ status: number; body: unknown }> {
  const request = new Request(`http://127.0.0.1${path}`, {
    method: init.method ?? "GET",
    ...(init.body !== undefined ? { body: JSON.stringify(init.body), headers: { "content-type": "application/json" } } : {}),
  });
  const res = (await route({ request, url: new URL(request.url), params, locals: { user: caller } } as never)) as Response;
  return { status: res.status, body: res.status === 204 ? null : await res.json() };
}

/** A member of the owner's organisation in `role`, through an invitation and its sign-up. */
export async function invitedMember(
  o: { headers: Headers; organizationId: string },
  role: "consultant" | "architect" | "client",
): Promise<RouteCaller> {
  const email = uniqueEmail(role);
  await inviteMember(o.headers, o.organizationId, email, role);
  const id = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
  const r = await signUp({ name: `Test ${role}`, email, password: "long password", invitationId: id });
  return { id: r.userId!, name: `Test ${role}`, email };
}
