// API callers for the matrix and fuzz tests: plain fetch with an explicit session cookie (no cookie jar, so a
// response that signs someone else in never changes who the next request is from), an Origin header as a
// browser sends, a per-request timeout and no redirects followed; or an API key as a script sends it.
import { expect, test } from "@playwright/test";
import { DEMO_PASSWORD, demoUser } from "@/lib/demo-scenario";
import type { RoleName } from "@/lib/auth/roles";
import { CONFIRMATION_SUBJECT, uniqueEmail, waitForMail } from "./helpers";

export type Actor = "anonymous" | RoleName | "outsider";
export const ACTORS: readonly Actor[] = ["anonymous", "outsider", "client", "architect", "consultant", "owner"];

export interface Caller {
  actor: Actor;
  /** The Cookie header of the session, or null when anonymous. */
  cookie: string | null;
  /**
   * An API key: sent as `Authorization: Bearer …` the way a script sends it, without cookie or Origin
   * (the key acts as `actor`, the member who made it).
   */
  bearer?: string;
}

export interface Answer {
  status: number;
  body: unknown;
  text: string;
  headers: Headers;
}

export const baseUrl = () => test.info().project.use.baseURL!;

export const ANONYMOUS: Caller = { actor: "anonymous", cookie: null };

/** One request; `body` is sent as JSON (a string or bytes are sent as they are). */
export async function call(caller: Caller, method: string, path: string, body?: unknown, timeoutMs = 15_000): Promise<Answer> {
  const base = baseUrl();
  const headers: Record<string, string> = caller.bearer
    ? { authorization: `Bearer ${caller.bearer}`, accept: "application/json" }
    : { origin: new URL(base).origin, accept: "application/json" };
  if (caller.cookie && !caller.bearer) headers.cookie = caller.cookie;
  // FormData (multipart uploads) sets its own content type with the boundary.
  if (body !== undefined && !(body instanceof FormData)) headers["content-type"] = "application/json";
  const res = await fetch(base + path, {
    method,
    headers,
    body:
      body === undefined
        ? undefined
        : typeof body === "string" || body instanceof Uint8Array || body instanceof FormData
          ? (body as string | Uint8Array<ArrayBuffer> | FormData)
          : JSON.stringify(body),
    redirect: "manual",
    signal: AbortSignal.timeout(timeoutMs),
  });
  const text = await res.text();
  let parsed: unknown = null;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    parsed = null;
  }
  return { status: res.status, body: parsed, text, headers: res.headers };
}

export const cookieOf = (res: Answer) =>
  res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");

export async function signInAs(actor: Actor, email: string, password: string): Promise<Caller> {
  const res = await call(ANONYMOUS, "POST", "/api/auth/sign-in/email", { email, password });
  expect(res.status, `sign-in of ${email}`).toBe(200);
  return { actor, cookie: cookieOf(res) };
}

export const signInDemo = (role: RoleName) => signInAs(role, demoUser(role).email, DEMO_PASSWORD);

export interface Outsider extends Caller {
  email: string;
  password: string;
  organizationId: string;
}

/**
 * A new account that owns a new organisation of its own, signed in: a member of another organisation than
 * the demo's. The one place that creates accounts for these tests.
 */
export async function createOutsider(tag = "outsider"): Promise<Outsider> {
  const email = uniqueEmail(tag);
  const password = "outsider-pass-2026";
  const res = await call(ANONYMOUS, "POST", "/api/v1/signup", { name: "Outside Member", email, password, organizationName: `Elsewhere ${email}` });
  expect(res.status, `sign-up of ${email}: ${res.text.slice(0, 200)}`).toBe(201);
  // The account is usable once its address is confirmed through the mailed link.
  const { link } = await waitForMail(email, { subject: CONFIRMATION_SUBJECT });
  const confirmed = await fetch(link, { redirect: "manual", signal: AbortSignal.timeout(15_000) });
  expect(confirmed.status, `confirmation link of ${email}`).toBeLessThan(400);
  const { cookie } = await signInAs("outsider", email, password);
  const me = (await call({ actor: "outsider", cookie }, "GET", "/api/v1/me")).body as { memberships: { organizationId: string }[] };
  return { actor: "outsider", cookie, email, password, organizationId: me.memberships[0]!.organizationId };
}

/**
 * Makes a new account a member of an organisation with `role`: the owner invites a fresh address and the
 * invitee signs up through the invitation. Returns the new member's id.
 */
export async function addMember(owner: Caller, organizationId: string, role: RoleName): Promise<{ memberId: string; email: string }> {
  const email = uniqueEmail(`member-${role}`);
  const inv = await call(owner, "POST", `/api/v1/orgs/${organizationId}/invitations`, { email, role });
  expect(inv.status, inv.text.slice(0, 200)).toBe(201);
  const invitationId = (inv.body as { invitation: { id: string } }).invitation.id;
  const res = await call(ANONYMOUS, "POST", "/api/v1/signup", { name: "Added Member", email, password: "added-member-2026", invitationId });
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  const members = (await call(owner, "GET", `/api/v1/orgs/${organizationId}/members`)).body as { members: { memberId: string; email: string }[] };
  return { memberId: members.members.find((m) => m.email === email)!.memberId, email };
}

/**
 * A throwaway project of the demo organisation, made by the demo consultant through the API (`body` without
 * the organisation): the consultant as a caller, the organisation's id and the project's.
 */
export async function throwawayProject(body: Record<string, unknown>): Promise<{ consultant: Caller; orgId: string; id: string }> {
  const consultant = await signInDemo("consultant");
  const me = (await call(consultant, "GET", "/api/v1/me")).body as { memberships: { organizationId: string }[] };
  const orgId = me.memberships[0]!.organizationId;
  const created = await call(consultant, "POST", "/api/v1/projects", { organizationId: orgId, ...body });
  if (created.status !== 201) throw new Error(`the throwaway project was refused: ${created.status} ${created.text.slice(0, 300)}`);
  return { consultant, orgId, id: (created.body as { project: { id: string } }).project.id };
}
