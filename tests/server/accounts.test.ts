// Server rules against a real (throwaway) PostgreSQL: sign-up, memberships, invitations, last-owner guard.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { invitation, member } from "@/lib/server/db/schema";
import { signUp, slugify } from "@/lib/server/services/accounts";
import { membershipsOf } from "@/lib/server/services/access";
import { acceptInvitation, changeRole, inviteMember, removeMember, membersOf, invitationSummary } from "@/lib/server/services/members";
import { problemFor } from "@/lib/server/http";
import { newOwner, uniqueEmail, cookieHeaders } from "./helpers";

afterAll(() => pool.end());

const status = async (p: Promise<unknown>) =>
  p.then(
    () => "ok" as const,
    (e) => problemFor(e)?.status ?? String(e),
  );

describe("sign-up", () => {
  it("creates the user, an organisation and an owner membership, and returns a session cookie", async () => {
    const o = await newOwner();
    const ms = await membershipsOf(o.userId);
    expect(ms).toHaveLength(1);
    expect(ms[0]).toMatchObject({ organizationId: o.organizationId, role: "owner" });
    expect(o.headers.get("cookie")).toMatch(/session_token=/);
  });

  it("creates no second account for a known e-mail (the answer is the same as for a new one) and keeps the first", async () => {
    const o = await newOwner();
    expect(await signUp({ name: "X", email: o.email, password: "another pw", organizationName: "Y" })).toEqual({
      kind: "pending-verification",
      userId: null,
      organizationId: null,
    });
    expect(await membershipsOf(o.userId)).toHaveLength(1);
  });

  it("makes URL-safe organisation slugs", () => {
    expect(slugify("Façade & Co. — Lisboa")).toBe("facade-co-lisboa");
    expect(slugify("!!!")).toBe("organisation");
  });
});

describe("invitations", () => {
  it("an invited person signs up into the inviting organisation with the invited role", async () => {
    const o = await newOwner();
    const email = uniqueEmail("invitee");
    const inv = await inviteMember(o.headers, o.organizationId, email, "architect");
    expect(inv).toBeTruthy();
    const id = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
    const joined = await signUp({ name: "Invitee", email, password: "long password", invitationId: id });
    expect(joined.organizationId).toBe(o.organizationId);
    expect(await membershipsOf(joined.userId)).toMatchObject([{ organizationId: o.organizationId, role: "architect" }]);
    expect((await invitationSummary(id))!.status).toBe("accepted");
    // used once
    expect(await status(acceptInvitation(joined.userId, email, id))).toBe(409);
  });

  it("an invitation cannot be taken by another address", async () => {
    const o = await newOwner();
    const other = await newOwner("intruder");
    await inviteMember(o.headers, o.organizationId, uniqueEmail("target"), "consultant");
    const id = (await db.select().from(invitation).where(eq(invitation.organizationId, o.organizationId)))[0]!.id;
    expect(await status(acceptInvitation(other.userId, other.email, id))).toBe(403);
    expect(await status(signUp({ name: "Z", email: uniqueEmail("wrong"), password: "long password", invitationId: id }))).toBe(400);
  });

  it("only owners may invite (better-auth enforces the same role table)", async () => {
    const o = await newOwner();
    const email = uniqueEmail("consultant");
    await inviteMember(o.headers, o.organizationId, email, "consultant");
    const id = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
    const c = await signUp({ name: "C", email, password: "long password", invitationId: id });
    const r = await status(inviteMember(cookieHeaders(c.headers), o.organizationId, uniqueEmail("x"), "client"));
    expect(r).not.toBe("ok");
  });

  it("refuses to invite an existing member (409)", async () => {
    const o = await newOwner();
    expect(await status(inviteMember(o.headers, o.organizationId, o.email, "client"))).toBe(409);
  });
});

describe("members", () => {
  it("keeps at least one owner", async () => {
    const o = await newOwner();
    const [me] = await membersOf(o.organizationId);
    expect(await status(changeRole(o.organizationId, me!.memberId, "consultant"))).toBe(409);
    expect(await status(removeMember(o.organizationId, me!.memberId))).toBe(409);
    expect((await db.select().from(member).where(eq(member.id, me!.memberId)))[0]!.role).toBe("owner");
  });

  it("does not touch members of another organisation", async () => {
    const a = await newOwner("a");
    const b = await newOwner("b");
    const [bOwner] = await membersOf(b.organizationId);
    expect(await status(removeMember(a.organizationId, bOwner!.memberId))).toBe(404);
  });
});
