// Authentication edge against a real (throwaway) PostgreSQL and the SMTP fake (MAIL_DIR): rate limits that a
// forged X-Forwarded-For cannot dodge, per-account limits, the route allowlist, e-mail confirmation, sign-up that
// does not reveal known addresses, reset links, and the roles a service accepts.
import { afterAll, describe, expect, it } from "vitest";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import type { APIContext } from "astro";
import { simpleParser } from "mailparser";
import { eq, like, sql } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { member, organization, user } from "@/lib/server/db/schema";
import { handleAuthRequest, limitSignUp } from "@/lib/server/auth-gate";
import { AUTH_ROUTES } from "@/lib/server/auth-routes";
import { clientAddressOf } from "@/lib/server/client-address";
import { AUTH_LIMITS } from "@/lib/server/rate-limit";
import { signUp } from "@/lib/server/services/accounts";
import { changeRole, membersOf } from "@/lib/server/services/members";
import { problemFor } from "@/lib/server/http";
import type { RoleName } from "@/lib/auth/roles";
import { POST as signUpEndpoint } from "@/pages/api/v1/signup";
import { newOwner, uniqueEmail } from "./helpers";

afterAll(() => pool.end());

const BASE = process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:4321";
let addressCounter = 0;
/** A distinct documentation-range address per call, so that tests do not share per-address counters. */
const uniqueAddress = () => `2001:db8::${(++addressCounter).toString(16)}:${(Date.now() % 65536).toString(16)}`;

function authRequest(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
  return new Request(`${BASE}/api/auth${path}`, {
    method,
    headers: { origin: BASE, ...(body === undefined ? {} : { "content-type": "application/json" }), ...headers },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

const gate = (req: Request, clientAddress = uniqueAddress()) => handleAuthRequest(req, { clientAddress, rateLimits: true });

const cookiesOf = (res: Response) =>
  res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");

/** The newest mail to `to` in MAIL_DIR with a subject matching `subject`, and its first link. */
async function mailTo(to: string, subject: RegExp, after = 0, timeoutMs = 10_000): Promise<{ subject: string; link: string; count: number }> {
  const dir = process.env.MAIL_DIR;
  if (!dir) throw new Error("MAIL_DIR is not set: run the server tests with the SMTP fake (npm test does)");
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const found: { subject: string; link: string }[] = [];
    for (const f of readdirSync(dir)
      .filter((x) => x.endsWith(".eml"))
      .sort()) {
      const mail = await simpleParser(readFileSync(join(dir, f)));
      const rcpt = [mail.to]
        .flat()
        .flatMap((a) => a?.value ?? [])
        .map((v) => v.address?.toLowerCase());
      if (rcpt.includes(to.toLowerCase()) && subject.test(mail.subject ?? "")) {
        found.push({ subject: mail.subject ?? "", link: /https?:\/\/\S+/.exec(mail.text ?? "")?.[0] ?? "" });
      }
    }
    if (found.length > after) return { ...found[found.length - 1]!, count: found.length };
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
}

/** Calls the sign-up endpoint as Astro would. */
async function postSignUp(body: unknown, clientAddress = uniqueAddress()): Promise<Response> {
  const request = new Request(`${BASE}/api/v1/signup`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: BASE },
    body: JSON.stringify(body),
  });
  return signUpEndpoint({
    request,
    params: {},
    locals: { user: null, session: null },
    clientAddress,
    url: new URL(request.url),
  } as unknown as APIContext);
}

describe("client address and per-address limits", () => {
  it("a forged X-Forwarded-For does not dodge the sign-in limit (real socket on loopback)", async () => {
    const server = http.createServer((req, res) => {
      const chunks: Buffer[] = [];
      req.on("data", (c: Buffer) => chunks.push(c));
      req.on("end", () => {
        const request = new Request(`${BASE}${req.url}`, {
          method: req.method,
          headers: Object.entries(req.headers).flatMap(([k, v]) => (typeof v === "string" ? [[k, v] as [string, string]] : [])),
          body: chunks.length ? Buffer.concat(chunks) : undefined,
        });
        // Astro's clientAddress would be the first X-Forwarded-For value: offer it as the fallback, it must be ignored.
        const astroAddress = req.headers["x-forwarded-for"]?.toString().split(",")[0];
        void handleAuthRequest(request, { clientAddress: clientAddressOf(request, astroAddress), rateLimits: true }).then(async (r) => {
          res.writeHead(r.status, Object.fromEntries(r.headers));
          res.end(Buffer.from(await r.arrayBuffer()));
        });
      });
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    try {
      await db.execute(sql`delete from auth_rate_limit where key = ${`${AUTH_LIMITS.signIn.name}:127.0.0.1`}`);
      const port = (server.address() as AddressInfo).port;
      const statuses: number[] = [];
      let retryAfter: string | null = null;
      for (let i = 0; i < AUTH_LIMITS.signIn.max + 5; i++) {
        const res = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in/email`, {
          method: "POST",
          headers: {
            "content-type": "application/json",
            origin: BASE,
            "x-forwarded-for": `198.51.100.${i + 1}`,
            forwarded: `for=198.51.100.${i + 1}`,
          },
          body: JSON.stringify({ email: uniqueEmail("guess"), password: `guess-${i}` }),
        });
        statuses.push(res.status);
        if (res.status === 429) retryAfter = res.headers.get("retry-after");
        await res.arrayBuffer();
      }
      expect(statuses.slice(0, AUTH_LIMITS.signIn.max).every((s) => s === 401)).toBe(true);
      expect(statuses.slice(AUTH_LIMITS.signIn.max)).toEqual(Array(5).fill(429));
      expect(Number(retryAfter)).toBeGreaterThan(0);
    } finally {
      await new Promise((r) => server.close(r));
      await db.execute(sql`delete from auth_rate_limit where key = ${`${AUTH_LIMITS.signIn.name}:127.0.0.1`}`);
    }
  }, 60_000);

  it("limits password-reset requests per address, the same for known and unknown addresses", async () => {
    const from = uniqueAddress();
    const o = await newOwner("reset-limit");
    const statuses: number[] = [];
    for (let i = 0; i < AUTH_LIMITS.passwordReset.max + 2; i++) {
      const email = i % 2 ? o.email : uniqueEmail("nobody");
      statuses.push((await gate(authRequest("POST", "/request-password-reset", { email, redirectTo: "/reset-password" }), from)).status);
    }
    expect(statuses).toEqual([...Array(AUTH_LIMITS.passwordReset.max).fill(200), 429, 429]);
  }, 30_000);

  it("limits sign-ups per address", async () => {
    const from = uniqueAddress();
    const results: (Response | null)[] = [];
    for (let i = 0; i < AUTH_LIMITS.signUp.max + 2; i++) {
      const request = new Request(`${BASE}/api/v1/signup`, { method: "POST" });
      results.push(await limitSignUp(request, from, true));
    }
    expect(results.slice(0, AUTH_LIMITS.signUp.max)).toEqual(Array(AUTH_LIMITS.signUp.max).fill(null));
    const refused = results.slice(AUTH_LIMITS.signUp.max);
    expect(refused.map((r) => r?.status)).toEqual([429, 429]);
    expect(Number(refused[0]!.headers.get("retry-after"))).toBeGreaterThan(0);
  });
});

describe("per-account sign-in limit", () => {
  it("after 5 failed sign-ins the account answers 429 with Retry-After, whatever the address, even to the right password", async () => {
    const o = await newOwner("locked");
    for (let i = 0; i < AUTH_LIMITS.signInFailuresPerAccount.max; i++) {
      expect((await gate(authRequest("POST", "/sign-in/email", { email: o.email, password: `wrong-${i}` }))).status).toBe(401);
    }
    const locked = await gate(authRequest("POST", "/sign-in/email", { email: o.email, password: o.password }));
    expect(locked.status).toBe(429);
    expect(Number(locked.headers.get("retry-after"))).toBeGreaterThan(60);
    expect((await locked.json()).detail).toMatch(/failed sign-ins for this account/);
  }, 30_000);

  it("a successful sign-in resets the account's failure count", async () => {
    const o = await newOwner("reset-count");
    const fail = () => gate(authRequest("POST", "/sign-in/email", { email: o.email, password: "wrong one" }));
    for (let i = 0; i < AUTH_LIMITS.signInFailuresPerAccount.max - 1; i++) expect((await fail()).status).toBe(401);
    expect((await gate(authRequest("POST", "/sign-in/email", { email: o.email, password: o.password }))).status).toBe(200);
    for (let i = 0; i < AUTH_LIMITS.signInFailuresPerAccount.max - 1; i++) expect((await fail()).status).toBe(401);
    expect((await gate(authRequest("POST", "/sign-in/email", { email: o.email, password: o.password }))).status).toBe(200);
  }, 30_000);
});

describe("route allowlist", () => {
  it("answers 404 for better-auth routes Paneray does not use, even to a signed-in owner", async () => {
    const o = await newOwner("allowlist");
    const cookie = o.headers.get("cookie")!;
    const [me] = await membersOf(o.organizationId);
    const refused: [string, string, unknown?][] = [
      ["GET", `/organization/list-members?organizationId=${o.organizationId}`],
      ["POST", "/organization/update-member-role", { memberId: me!.memberId, role: "admin", organizationId: o.organizationId }],
      ["POST", "/organization/create", { name: "Side firm", slug: `side-${Date.now()}` }],
      ["POST", "/sign-up/email", { name: "N", email: uniqueEmail("direct"), password: "long password" }],
      ["GET", "/list-sessions"],
      ["POST", "/sign-in/email/../../organization/create", { name: "X", slug: "x" }],
      ["GET", "/sign-in/email"],
    ];
    for (const [method, path, body] of refused) {
      const res = await gate(authRequest(method, path, body, { cookie }));
      expect(res.status, `${method} ${path}`).toBe(404);
    }
    expect((await db.select().from(member).where(eq(member.id, me!.memberId)))[0]!.role).toBe("owner");
    expect(await db.select().from(organization).where(like(organization.name, "Side firm"))).toHaveLength(0);
    const session = await gate(authRequest("GET", "/get-session", undefined, { cookie }));
    expect(session.status).toBe(200);
    expect((await session.json()).user.email).toBe(o.email);
  });

  it("lists exactly the routes the product uses", () => {
    expect(AUTH_ROUTES.map((r) => `${r.method} ${r.path}`).sort()).toEqual(
      [
        "POST /sign-in/email",
        "POST /sign-out",
        "GET /get-session",
        "POST /request-password-reset",
        "POST /reset-password",
        "GET /reset-password/:token",
        "GET /verify-email",
      ].sort(),
    );
  });
});

describe("sign-up and e-mail confirmation", () => {
  it("a known address gets exactly the answer a new one gets, and its owner a notice by mail", async () => {
    const o = await newOwner("known");
    const fresh = await postSignUp({ name: "New", email: uniqueEmail("fresh"), password: "long password", organizationName: "Fresh firm" });
    const known = await postSignUp({ name: "Again", email: o.email, password: "other password", organizationName: "Other firm" });
    expect(known.status).toBe(fresh.status);
    expect(fresh.status).toBe(201);
    expect(await known.text()).toBe(await fresh.text());
    expect(known.headers.getSetCookie()).toEqual([]);
    expect((await mailTo(o.email, /tried to create a Paneray account/)).subject).toMatch(/your address/);
    expect(await db.select().from(user).where(eq(user.email, o.email))).toHaveLength(1);
  }, 30_000);

  it("an unconfirmed account cannot sign in; the mailed link confirms it and signs in; the sign-in JSON has no token", async () => {
    const email = uniqueEmail("confirm");
    const password = "long password";
    const r = await signUp({ name: "Confirm", email, password, organizationName: "Confirm firm" });
    expect(r.kind).toBe("pending-verification");
    const refused = await gate(authRequest("POST", "/sign-in/email", { email, password }));
    expect(refused.status).toBe(403);
    expect((await refused.json()).code).toBe("EMAIL_NOT_VERIFIED");
    const { link } = await mailTo(email, /Confirm your e-mail address/);
    expect(link).toContain("/api/auth/verify-email?token=");
    const confirmed = await gate(new Request(link.replace(/^https?:\/\/[^/]+/, BASE), { headers: { origin: BASE } }));
    expect([302, 200]).toContain(confirmed.status);
    expect(cookiesOf(confirmed)).toMatch(/session_token=/);
    expect((await db.select().from(user).where(eq(user.email, email)))[0]!.emailVerified).toBe(true);

    const ok = await gate(authRequest("POST", "/sign-in/email", { email, password }));
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as Record<string, unknown>;
    expect(body).not.toHaveProperty("token");
    expect(body.user).toMatchObject({ email });
    expect(JSON.stringify(body)).not.toContain(/session_token=([^.;]+)/.exec(cookiesOf(ok))![1]!);
    expect(cookiesOf(ok)).toMatch(/session_token=/);
  }, 30_000);

  it("writes user, organisation and owner membership in one transaction: a failure leaves nothing behind", async () => {
    const email = uniqueEmail("txfail");
    await db.execute(sql`create or replace function test_refuse_member() returns trigger language plpgsql as $$
      begin
        if exists (select 1 from "user" where id = new.user_id and email like 'txfail-%') then raise exception 'refused by test'; end if;
        return new;
      end $$`);
    await db.execute(sql`create trigger test_refuse_member before insert on member for each row execute function test_refuse_member()`);
    try {
      await expect(signUp({ name: "Tx", email, password: "long password", organizationName: "Tx firm unique" })).rejects.toThrow();
    } finally {
      await db.execute(sql`drop trigger if exists test_refuse_member on member`);
      await db.execute(sql`drop function if exists test_refuse_member()`);
    }
    expect(await db.select().from(user).where(eq(user.email, email))).toHaveLength(0);
    expect(await db.select().from(organization).where(eq(organization.name, "Tx firm unique"))).toHaveLength(0);
  });
});

describe("password reset links", () => {
  it("an older link stops working once a newer one is issued", async () => {
    const o = await newOwner("relink");
    const ask = () => gate(authRequest("POST", "/request-password-reset", { email: o.email, redirectTo: "/reset-password" }));
    expect((await ask()).status).toBe(200);
    const first = await mailTo(o.email, /Reset your Paneray password/);
    expect((await ask()).status).toBe(200);
    const second = await mailTo(o.email, /Reset your Paneray password/, first.count);
    const tokenOf = (link: string) => /\/reset-password\/([^?]+)/.exec(link)![1]!;
    // The newer mail is sent after the older tokens are dropped.
    const old = await gate(authRequest("GET", `/reset-password/${tokenOf(first.link)}?callbackURL=/reset-password`));
    expect(old.status).toBe(302);
    expect(old.headers.get("location")).toMatch(/error=INVALID_TOKEN/);
    const oldReset = await gate(authRequest("POST", "/reset-password", { token: tokenOf(first.link), newPassword: "brand new pw 1" }));
    expect(oldReset.status).toBe(400);
    const newReset = await gate(authRequest("POST", "/reset-password", { token: tokenOf(second.link), newPassword: "brand new pw 2" }));
    expect(newReset.status).toBe(200);
    expect((await gate(authRequest("POST", "/sign-in/email", { email: o.email, password: "brand new pw 2" }))).status).toBe(200);
  }, 30_000);
});

describe("roles", () => {
  it("an owner cannot give a role outside the four (e.g. admin, or two at once)", async () => {
    const o = await newOwner("roles");
    const [me] = await membersOf(o.organizationId);
    for (const role of ["admin", "owner,client", ""]) {
      const err = await changeRole(o.organizationId, me!.memberId, role as RoleName).then(
        () => null,
        (e: unknown) => e,
      );
      expect(problemFor(err)?.status, role).toBe(400);
    }
    expect((await db.select().from(member).where(eq(member.id, me!.memberId)))[0]!.role).toBe("owner");
  });
});
