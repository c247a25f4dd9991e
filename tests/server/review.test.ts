// Comments, decisions and history of façade options against PostgreSQL: the access rule of every review
// route per role, one approved option per façade (also under concurrent approvals), replies within one
// option only, and the history's pages.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { facadeOption, makeup, makeupRevision, projectEvent } from "@/lib/server/db/schema";
import { requireOption, requireProject } from "@/lib/server/services/access";
import { createProject, facadesOf, projectsForUser, shareProject } from "@/lib/server/services/projects";
import { addComment, commentsOf, decide, historyOf } from "@/lib/server/services/review";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { CommentRequest, DecisionRequest } from "@/lib/contracts/review";
import { InstantPageQuery } from "@/lib/contracts/pagination";
import { permissionFor, type PermissionKey } from "@/lib/auth/roles";
import { ROUTES } from "@/lib/auth/route-table";
import { problemFor } from "@/lib/server/http";
import { invitedMember, newOwner } from "./helpers";

afterAll(() => pool.end());
const status = async (p: Promise<unknown>) =>
  p.then(
    () => "ok" as const,
    (e) => problemFor(e)?.status ?? String(e),
  );

const join = invitedMember;

/** An organisation with one member per role, a project of two façades shared with the client, two options per façade. */
async function world() {
  const o = await newOwner();
  const [consultant, architect, client] = [await join(o, "consultant"), await join(o, "architect"), await join(o, "client")];
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Review tower",
      siteName: "Plot 4",
      latitudeDeg: 38.72,
      longitudeDeg: -9.14,
      timeZone: "Europe/Lisbon",
      facades: [
        { name: "South", azimuthDeg: 180 },
        { name: "East", azimuthDeg: 90 },
      ],
    }),
    o.userId,
  );
  const cm = (await projectsForUser(client.id))[0]!.membership;
  await shareProject(p, cm.memberId, o.userId);
  const [m] = await db.insert(makeup).values({ organizationId: o.organizationId, name: "Clear double", createdById: o.userId }).returning();
  const layers = [
    { kind: "pane", thicknessMm: 6 },
    { kind: "gap", widthMm: 16, gas: "argon", fraction: 0.9 },
    { kind: "pane", thicknessMm: 4 },
  ];
  const [rev] = await db
    .insert(makeupRevision)
    .values({ makeupId: m!.id, revision: 1, name: "Clear double", description: "6 | 16 Ar 90% | 4", layers, values: { uValue: 2.6 } })
    .returning();
  const fs = await facadesOf(p.id);
  const options = await db
    .insert(facadeOption)
    .values(
      fs.flatMap((f) =>
        ["A", "B"].map((n, i) => ({
          projectId: p.id,
          facadeId: f.id,
          makeupId: m!.id,
          makeupRevisionId: rev!.id,
          name: `${f.name} ${n}`,
          position: i,
        })),
      ),
    )
    .returning();
  const owner = { id: o.userId, name: "Test owner" };
  return { o, owner, consultant, architect, client, p, fs, options };
}

/** What the route's declared rule answers for a user: "ok", 403 or 404. */
async function allowed(path: string, method: string, userId: string, optionId: string, projectId: string) {
  const row = ROUTES.find((r) => r.path === path && r.method === method)!;
  const rule = row.auth as { permission?: PermissionKey; option?: string; project?: string };
  const perm = rule.permission ? permissionFor(rule.permission) : undefined;
  return "option" in rule ? status(requireOption(userId, optionId, perm)) : status(requireProject(userId, projectId, perm));
}

describe("review routes per role", () => {
  it("architect and owner comment and decide, consultant comments but cannot decide, client and another organisation are refused", async () => {
    const w = await world();
    const other = await newOwner("other");
    const opt = w.options[0]!.id;
    const cases: [string, string, Record<string, string | number>][] = [
      ["/api/v1/options/:id/comments", "GET", { owner: "ok", consultant: "ok", architect: "ok", client: 403, other: 404 }],
      ["/api/v1/options/:id/comments", "POST", { owner: "ok", consultant: "ok", architect: "ok", client: 403, other: 404 }],
      ["/api/v1/options/:id/decision", "POST", { owner: "ok", consultant: 403, architect: "ok", client: 403, other: 404 }],
      ["/api/v1/projects/:id/history", "GET", { owner: "ok", consultant: "ok", architect: "ok", client: 403, other: 404 }],
    ];
    const users: Record<string, string> = {
      owner: w.owner.id,
      consultant: w.consultant.id,
      architect: w.architect.id,
      client: w.client.id,
      other: other.userId,
    };
    for (const [path, method, expected] of cases) {
      for (const [who, want] of Object.entries(expected)) {
        expect(`${method} ${path} ${who}: ${await allowed(path, method, users[who]!, opt, w.p.id)}`).toBe(`${method} ${path} ${who}: ${want}`);
      }
    }
    // A missing option is a 404, like one of another organisation.
    expect(await status(requireOption(w.architect.id, "no-such-option", permissionFor("comment:create")))).toBe(404);
  });
});

describe("comments", () => {
  it("threads replies under their parent, oldest first, with author names", async () => {
    const w = await world();
    const option = w.options[0]!;
    const first = await addComment(option, w.architect, CommentRequest.parse({ body: "Is the g-value low enough for the\nsouth façade?" }));
    const reply = await addComment(option, w.consultant, CommentRequest.parse({ body: "Yes, 0.38 against a limit of 0.40.", parentId: first.id }));
    expect(first.body).toBe("Is the g-value low enough for the\nsouth façade?");
    expect(reply.parentId).toBe(first.id);
    const thread = await commentsOf(option.id);
    expect(thread.map((c) => [c.author.name, c.parentId])).toEqual([
      ["Test architect", null],
      ["Test consultant", first.id],
    ]);
  });

  it("refuses a reply to a comment of another option (400 naming parentId)", async () => {
    const w = await world();
    const elsewhere = await addComment(w.options[1]!, w.architect, CommentRequest.parse({ body: "On B" }));
    const err = await addComment(w.options[0]!, w.architect, CommentRequest.parse({ body: "Reply", parentId: elsewhere.id })).then(
      () => null,
      (e: unknown) => problemFor(e),
    );
    expect(err?.status).toBe(400);
    expect(err?.extra.errors?.[0]?.field).toBe("parentId");
    expect(await commentsOf(w.options[0]!.id)).toHaveLength(0);
  });

  it("validates the body in words", () => {
    const empty = CommentRequest.safeParse({ body: "   " });
    expect(empty.success).toBe(false);
    expect(empty.error?.issues[0]?.message).toBe("Comment is required");
    expect(CommentRequest.safeParse({ body: "x".repeat(5001) }).error?.issues[0]?.message).toBe("Comment must be at most 5000 characters");
    expect(CommentRequest.safeParse({ body: "bell\u0007" }).success).toBe(false);
    expect(DecisionRequest.safeParse({ decision: "maybe" }).error?.issues[0]?.message).toBe("Decision must be “approved” or “rejected”");
  });
});

describe("decisions", () => {
  it("approving a second option of a façade puts the first back to proposed and says so", async () => {
    const w = await world();
    const [a, b, east] = [w.options[0]!, w.options[1]!, w.options[2]!];
    const r1 = await decide(a.id, w.architect, { decision: "approved", note: "Best daylight" });
    expect(r1.option.status).toBe("approved");
    expect(r1.previouslyApproved).toBeUndefined();
    await decide(east.id, w.architect, { decision: "approved" });
    const r2 = await decide(b.id, w.owner, { decision: "approved" });
    expect(r2.previouslyApproved?.id).toBe(a.id);
    expect(r2.previouslyApproved?.status).toBe("proposed");
    const rows = await db.select().from(facadeOption).where(eq(facadeOption.projectId, w.p.id));
    const approved = rows.filter((r) => r.status === "approved").map((r) => r.id);
    expect(approved.sort()).toEqual([b.id, east.id].sort());
    const rej = await decide(a.id, w.architect, { decision: "rejected", note: "Too much glare" });
    expect(rej.option.status).toBe("rejected");
    expect(rej.decisions.map((d) => d.decision)).toEqual(["approved", "rejected"]);
    const events = await db.select().from(projectEvent).where(eq(projectEvent.projectId, w.p.id));
    expect(events.filter((e) => e.kind === "option.approved")).toHaveLength(3);
    expect(events.some((e) => e.summary.includes("replacing “South A”"))).toBe(true);
  });

  it("two approvals of one façade at the same moment leave exactly one approved", async () => {
    const w = await world();
    const [a, b] = [w.options[0]!, w.options[1]!];
    const results = await Promise.allSettled([decide(a.id, w.architect, { decision: "approved" }), decide(b.id, w.owner, { decision: "approved" })]);
    for (const r of results) if (r.status === "rejected") expect(problemFor(r.reason)?.status).toBe(409);
    const rows = await db.select().from(facadeOption).where(eq(facadeOption.facadeId, a.facadeId));
    expect(rows.filter((r) => r.status === "approved")).toHaveLength(1);
  });
});

describe("history", () => {
  it("pages newest first with a cursor, no event twice or missed", async () => {
    const w = await world();
    for (let i = 0; i < 7; i++) await addComment(w.options[0]!, w.architect, CommentRequest.parse({ body: `Comment ${i}` }));
    const seen: string[] = [];
    let cursor: string | undefined;
    let pages = 0;
    do {
      const page = await historyOf(w.p.id, InstantPageQuery.parse({ limit: "3", ...(cursor ? { cursor } : {}) }));
      seen.push(...page.items.map((i) => i.id));
      cursor = page.nextCursor ?? undefined;
      pages++;
    } while (cursor);
    const all = await db.select().from(projectEvent).where(eq(projectEvent.projectId, w.p.id));
    expect(new Set(seen).size).toBe(all.length);
    expect(seen.length).toBe(all.length);
    expect(pages).toBe(Math.ceil(all.length / 3));
    const first = await historyOf(w.p.id, InstantPageQuery.parse({}));
    expect(first.items[0]!.summary).toBe("Commented on “South A”");
    expect(first.items[0]!.actor).toBe("Test architect");
    expect(InstantPageQuery.safeParse({ limit: "101" }).success).toBe(false);
  });
});
