// E-mail deliveries against PostgreSQL and the local SMTP fake: the routes by role, validation (nothing stored on
// a refusal), the organisation's hourly limit, paging, and a delivery sent by the job worker, read back from the
// fake's store with mailparser and its workbook opened with exceljs, its schedule compared with the revision API.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

// Before any module reads the environment: a free port for this file's SMTP fake, a small hourly limit.
const smtp = await vi.hoisted(async () => {
  const { execFileSync } = await import("node:child_process");
  const { mkdtempSync } = await import("node:fs");
  const { tmpdir } = await import("node:os");
  const { join } = await import("node:path");
  const port = Number(
    execFileSync("node", [
      "-e",
      'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})',
    ]).toString(),
  );
  const dir = mkdtempSync(join(tmpdir(), "paneray-delivery-mail-"));
  process.env.SMTP_URL = `smtp://127.0.0.1:${port}`;
  process.env.DELIVERY_RATE_LIMIT = "8";
  process.env.DELIVERY_RETRY_DELAY_SECONDS = "1";
  process.env.JOB_POLL_SECONDS = "0.5";
  return { port, dir };
});

import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import { readdirSync, readFileSync, rmSync } from "node:fs";
import { join } from "node:path";
import net from "node:net";
import { eq, sql } from "drizzle-orm";
import ExcelJS from "exceljs";
import { simpleParser } from "mailparser";
import { db, pool } from "@/lib/server/db/client";
import { delivery, facade, member, projectEvent } from "@/lib/server/db/schema";
import { createProject, shareProject } from "@/lib/server/services/projects";
import { issueRevision } from "@/lib/server/services/revisions";
import { attemptDelivery, deliveryStatus, failAbandonedDeliveries } from "@/lib/server/services/deliveries";
import { startWorker, stopWorker } from "@/lib/server/jobs/worker";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import type { DeliveryResponse } from "@/lib/contracts/deliveries";
import type { RevisionResponse } from "@/lib/contracts/results";
import { GET as listRoute, POST as sendRoute } from "@/pages/api/v1/projects/[id]/deliveries";
import { GET as statusRoute } from "@/pages/api/v1/deliveries/[id]/index";
import { GET as attachmentRoute } from "@/pages/api/v1/deliveries/[id]/attachment";
import { GET as revisionRoute } from "@/pages/api/v1/projects/[id]/revisions/[rev]";
import { callRoute, invitedMember, newOwner, type RouteCaller } from "./helpers";
import { clear, double, insertMakeup, insertOption, tinted } from "./workspace-fixtures";

type Route = Parameters<typeof callRoute>[0];
const call = (route: Route, caller: RouteCaller, path: string, params: Record<string, string>, init: { method?: string; body?: unknown } = {}) =>
  callRoute(route, caller, path, params, init) as Promise<{ status: number; body: any }>; // eslint-disable-line @typescript-eslint/no-explicit-any -- each test reads its own response shape

let fake: ChildProcess | null = null;
let owner: RouteCaller;
let consultant: RouteCaller;
let architect: RouteCaller;
let client: RouteCaller;
let outsider: RouteCaller;
let projectId: string;
let organizationId: string;
let clientMemberId: string;
let unsharedClientMemberId: string;
let otherOrgMemberId: string;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function startFake(): Promise<void> {
  fake = spawn("node", ["scripts/smtp-fake.mjs"], { env: { ...process.env, MAIL_DIR: smtp.dir, SMTP_PORT: String(smtp.port) }, stdio: "ignore" });
  for (let i = 0; i < 100; i++) {
    const up = await new Promise<boolean>((resolve) => {
      const c = net.connect(smtp.port, "127.0.0.1");
      c.once("connect", () => (c.end(), resolve(true)));
      c.once("error", () => resolve(false));
    });
    if (up) return;
    await sleep(100);
  }
  throw new Error("the SMTP fake did not start");
}

async function waitForStatus(id: string, want: DeliveryResponse["status"], budgetMs = 20_000): Promise<DeliveryResponse> {
  const until = Date.now() + budgetMs;
  let last: DeliveryResponse | null = null;
  while (Date.now() < until) {
    last = await deliveryStatus(id);
    if (last?.status === want) return last;
    await sleep(200);
  }
  throw new Error(`delivery ${id} not ${want} within ${budgetMs} ms (last: ${JSON.stringify(last)})`);
}

const deliveryCount = async () => Number((await db.select({ n: sql<number>`count(*)::int` }).from(delivery))[0]!.n);

beforeAll(async () => {
  const o = await newOwner("delivery");
  owner = { id: o.userId, name: "Test delivery", email: o.email };
  organizationId = o.organizationId;
  consultant = await invitedMember(o, "consultant");
  architect = await invitedMember(o, "architect");
  client = await invitedMember(o, "client");
  const other = await invitedMember(o, "client");
  const x = await newOwner("delivery-outsider");
  outsider = { id: x.userId, name: "Test delivery-outsider", email: x.email };
  otherOrgMemberId = (await db.select().from(member).where(eq(member.userId, x.userId)))[0]!.id;
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId,
      name: "Delivery test house",
      siteName: "Invented plot 7",
      latitudeDeg: 47.37,
      longitudeDeg: 8.54,
      timeZone: "Europe/Zurich",
      facades: [
        { name: "South", azimuthDeg: 180 },
        { name: "East", azimuthDeg: 90 },
      ],
    }),
    o.userId,
  );
  projectId = p.id;
  const members = await db.select().from(member).where(eq(member.organizationId, organizationId));
  clientMemberId = members.find((m) => m.userId === client.id)!.id;
  unsharedClientMemberId = members.find((m) => m.userId === other.id)!.id;
  await shareProject(p, clientMemberId, o.userId);
  const fs = await db.select().from(facade).where(eq(facade.projectId, p.id));
  const a = await insertMakeup(organizationId, "Delivery clear double", double(clear(6), clear(4)));
  const b = await insertMakeup(organizationId, "Delivery tinted double", double(tinted(8), clear(4)));
  await insertOption(p.id, fs.find((f) => f.name === "South")!.id, b, "South tinted", "approved");
  await insertOption(p.id, fs.find((f) => f.name === "East")!.id, a, "East clear", "approved");
  await issueRevision(p.id, { id: o.userId, name: "Test delivery" }, { note: "For the delivery test", year: 2025 });
});

afterAll(async () => {
  await stopWorker(5_000);
  fake?.kill("SIGTERM");
  await pool.end();
  rmSync(smtp.dir, { recursive: true, force: true });
});

const send = (caller: RouteCaller, body: unknown) =>
  call(sendRoute, caller, `/api/v1/projects/${projectId}/deliveries`, { id: projectId }, { method: "POST", body });

describe("POST /api/v1/projects/:id/deliveries", () => {
  it("answers 202 at once with a queued delivery, its queue job written in the same transaction", async () => {
    const res = await send(consultant, { revision: "A", to: ["Design.Team@orla-kemp-test.example"], message: "Revision A for your review." });
    expect(res.status, JSON.stringify(res.body)).toBe(202);
    expect(res.body).toMatchObject({ status: "queued", delivery: { revision: "A", attempts: 0, attachment: null } });
    expect(res.body.delivery.recipients).toEqual([{ email: "design.team@orla-kemp-test.example" }]);
    const row = (await db.select().from(delivery).where(eq(delivery.id, res.body.id)))[0]!;
    expect(row.jobId).toMatch(/^[0-9a-f-]{36}$/);
    const job = await pool.query("select name, data, retry_limit from pgboss.job where id = $1", [row.jobId]);
    expect(job.rows[0]).toMatchObject({ name: "delivery-mail", data: { deliveryId: row.id }, retry_limit: 5 });
    const events = await db.select().from(projectEvent).where(eq(projectEvent.projectId, projectId));
    expect(events.some((e) => e.kind === "delivery.queued")).toBe(true);
  });

  it("is for owners and consultants: architects and clients 403, another organisation 404", async () => {
    const body = { revision: "A", to: ["someone@test.example"] };
    expect((await send(owner, body)).status).toBe(202);
    for (const who of [architect, client]) {
      const res = await send(who, body);
      expect(res.status).toBe(403);
      expect(res.body.detail).toMatch(/does not allow you to export or send schedules/);
    }
    expect((await send(outsider, body)).status).toBe(404);
    expect((await call(listRoute, architect, `/api/v1/projects/${projectId}/deliveries`, { id: projectId })).status).toBe(403);
    expect((await call(listRoute, outsider, `/api/v1/projects/${projectId}/deliveries`, { id: projectId })).status).toBe(404);
  });

  it("refuses bad recipients and unissued revisions naming the field, and stores nothing", async () => {
    const before = await deliveryCount();
    const cases: [unknown, string, RegExp][] = [
      [{ revision: "A", to: ["not-an-address"] }, "to[0]", /not a valid e-mail address/],
      [{ revision: "A", to: [] }, "to", /at least one recipient/],
      [{ revision: "A" }, "to", /at least one recipient/],
      [{ revision: "A", to: Array.from({ length: 51 }, (_, i) => `r${i}@test.example`) }, "to", /at most 50/],
      [
        { revision: "A", to: Array.from({ length: 30 }, (_, i) => `r${i}@test.example`), memberIds: Array.from({ length: 21 }, (_, i) => `m${i}`) },
        "to",
        /at most 50 recipients/,
      ],
      [{ revision: "B", to: ["a@test.example"] }, "revision", /no issued revision B/],
      [{ revision: "a1", to: ["a@test.example"] }, "revision", /letter of an issued revision/],
      [{ revision: "A", memberIds: ["no-such-member"] }, "memberIds[0]", /not a member of this project's organisation/],
      [{ revision: "A", memberIds: [unsharedClientMemberId] }, "memberIds[0]", /shared with them/],
      [{ revision: "A", memberIds: [otherOrgMemberId] }, "memberIds[0]", /not a member/],
      [{ revision: "A", to: ["a@test.example"], message: "bell \u0007" }, "message", /control characters/],
      [{ revision: "A", to: ["a@test.example"], cc: ["b@test.example"] }, "(body)", /.+/],
    ];
    for (const [body, field, message] of cases) {
      const res = await send(consultant, body);
      expect(res.status, JSON.stringify(body).slice(0, 120)).toBe(400);
      const err = (res.body.errors as { field: string; message: string }[]).find((e) => e.field === field) ?? res.body.errors[0];
      if (field !== "(body)") expect(err.field).toBe(field);
      expect(err.message).toMatch(message);
    }
    expect(await deliveryCount()).toBe(before);
  });

  it("resolves members to their addresses, once each", async () => {
    const res = await send(consultant, { revision: "A", memberIds: [clientMemberId, clientMemberId], to: [client.email.toUpperCase()] });
    expect(res.status).toBe(202);
    expect(res.body.delivery.recipients).toEqual([{ email: client.email, name: "Test client", memberId: clientMemberId }]);
  });

  it("limits deliveries per organisation and hour: 429 with Retry-After, nothing queued", async () => {
    const o = await newOwner("delivery-limit");
    const me = { id: o.userId, name: "Test delivery-limit", email: o.email };
    const p = await createProject(
      ProjectCreateRequest.parse({
        organizationId: o.organizationId,
        name: "Limit test",
        siteName: "Plot",
        latitudeDeg: 50,
        longitudeDeg: 5,
        timeZone: "UTC",
        facades: [{ name: "South", azimuthDeg: 180 }],
      }),
      o.userId,
    );
    const f = (await db.select().from(facade).where(eq(facade.projectId, p.id)))[0]!;
    await insertOption(p.id, f.id, await insertMakeup(o.organizationId, "Limit double", double(clear(6), clear(6))), "Clear", "approved");
    await issueRevision(p.id, me, { note: null, year: 2025 });
    const statuses: number[] = [];
    for (let i = 0; i < 9; i++) {
      const res = await callRoute(
        sendRoute,
        me,
        `/api/v1/projects/${p.id}/deliveries`,
        { id: p.id },
        { method: "POST", body: { revision: "A", to: [`limit${i}@test.example`] } },
      );
      statuses.push(res.status);
      if (res.status === 429) expect((res.body as { detail: string }).detail).toMatch(/8 deliveries in the last hour/);
    }
    expect(statuses).toEqual([202, 202, 202, 202, 202, 202, 202, 202, 429]);
    const counted = Number(
      (
        await db
          .select({ n: sql<number>`count(*)::int` })
          .from(delivery)
          .where(eq(delivery.projectId, p.id))
      )[0]!.n,
    );
    expect(counted).toBe(8);
    // The header itself, through the route's Response.
    const request = new Request(`http://127.0.0.1/api/v1/projects/${p.id}/deliveries`, {
      method: "POST",
      body: JSON.stringify({ revision: "A", to: ["again@test.example"] }),
      headers: { "content-type": "application/json" },
    });
    const raw = (await sendRoute({ request, url: new URL(request.url), params: { id: p.id }, locals: { user: me } } as never)) as Response;
    expect(raw.status).toBe(429);
    expect(Number(raw.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(Number(raw.headers.get("retry-after"))).toBeLessThanOrEqual(3600);
  });
});

describe("GET deliveries", () => {
  it("pages the project's deliveries newest first, and reads one by id with the project's rule", async () => {
    const first = await call(listRoute, consultant, `/api/v1/projects/${projectId}/deliveries?limit=2`, { id: projectId });
    expect(first.status).toBe(200);
    expect(first.body.deliveries).toHaveLength(2);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const second = await call(listRoute, consultant, `/api/v1/projects/${projectId}/deliveries?limit=2&cursor=${first.body.nextCursor}`, {
      id: projectId,
    });
    const ids = [...first.body.deliveries, ...second.body.deliveries].map((d: DeliveryResponse) => d.id);
    expect(new Set(ids).size).toBe(ids.length);
    const times = [...first.body.deliveries, ...second.body.deliveries].map((d: DeliveryResponse) => d.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect((await call(listRoute, consultant, `/api/v1/projects/${projectId}/deliveries?limit=0`, { id: projectId })).status).toBe(400);

    const id = ids[0]!;
    const one = await call(statusRoute, owner, `/api/v1/deliveries/${id}`, { id });
    expect(one.status).toBe(200);
    expect(one.body.delivery).toMatchObject({ id, revision: "A" });
    expect((await call(statusRoute, client, `/api/v1/deliveries/${id}`, { id })).status).toBe(403);
    expect((await call(statusRoute, outsider, `/api/v1/deliveries/${id}`, { id })).status).toBe(404);
    expect((await call(statusRoute, owner, `/api/v1/deliveries/no-such-id`, { id: "no-such-id" })).status).toBe(404);
  });
});

describe("the delivery job", () => {
  it("records the SMTP error and ends failed after the last retry", async () => {
    // No SMTP fake listens yet: the connection is refused.
    const res = await send(consultant, { revision: "A", to: ["refused@test.example"] });
    await expect(attemptDelivery(res.body.id, { retryCount: 0, retryLimit: 1 })).rejects.toThrow(/ECONNREFUSED/);
    let d = (await deliveryStatus(res.body.id))!;
    expect(d).toMatchObject({ status: "queued", attempts: 1 });
    expect(d.lastError).toMatch(/ECONNREFUSED/);
    expect(d.attachment?.sha256).toMatch(/^[0-9a-f]{64}$/);
    const firstSha = d.attachment!.sha256;
    await expect(attemptDelivery(res.body.id, { retryCount: 1, retryLimit: 1 })).rejects.toThrow(/ECONNREFUSED/);
    d = (await deliveryStatus(res.body.id))!;
    expect(d).toMatchObject({ status: "failed", attempts: 2, sentAt: null });
    expect(d.attachment!.sha256).toBe(firstSha); // built once, kept for every attempt
    // Final: a job that runs again changes nothing.
    expect(await attemptDelivery(res.body.id, { retryCount: 2, retryLimit: 1 })).toBe("failed");
  });

  it("a delivery whose job failed for good while it said sending (its worker stopped mid-attempt) is marked failed", async () => {
    const res = await send(consultant, { revision: "A", to: ["cut-short@test.example"] });
    const row = (await db.select().from(delivery).where(eq(delivery.id, res.body.id)))[0]!;
    await db.update(delivery).set({ status: "sending", attempts: 3 }).where(eq(delivery.id, row.id));
    expect(await failAbandonedDeliveries()).toBe(0); // its job is still alive: nothing to do
    await pool.query("update pgboss.job set state = 'failed' where id = $1", [row.jobId]);
    expect(await failAbandonedDeliveries()).toBe(1);
    const d = (await deliveryStatus(row.id))!;
    expect(d.status).toBe("failed");
    expect(d.lastError).toMatch(/cut short/);
    expect(await failAbandonedDeliveries()).toBe(0); // final: marked once
  });

  it("sends the workbook; the message read back has the revision's schedule numbers", async () => {
    await startFake();
    startWorker();
    const res = await send(consultant, {
      revision: "A",
      memberIds: [clientMemberId],
      to: ["facade.lead@orla-kemp-test.example"],
      message: "Here is revision A.",
    });
    expect(res.status).toBe(202);
    // The workbook is written on its export thread, compiled from the sources in tests: slow on a busy machine.
    const d = await waitForStatus(res.body.id, "sent", 60_000);
    expect(d.attempts).toBe(1);
    expect(d.messageId).toMatch(/^<.+>$/);
    expect(d.sentAt).not.toBeNull();

    // The message as the SMTP server stored it.
    let mail: Awaited<ReturnType<typeof simpleParser>> | undefined;
    for (const f of readdirSync(smtp.dir).filter((n) => n.endsWith(".eml"))) {
      const m = await simpleParser(readFileSync(join(smtp.dir, f)));
      if (m.messageId === d.messageId) mail = m;
    }
    expect(mail, "the fake stored the message with the delivery's Message-ID").toBeDefined();
    const to = [mail!.to]
      .flat()
      .flatMap((a) => a?.value ?? [])
      .map((a) => a.address);
    expect(to.sort()).toEqual([client.email, "facade.lead@orla-kemp-test.example"].sort());
    expect(mail!.subject).toBe("Glazing schedule Delivery test house, revision A");
    expect(mail!.text).toContain("Here is revision A.");
    expect(mail!.text).toMatch(/estimates .* not certified or declared values/);
    expect(mail!.attachments).toHaveLength(1);
    const att = mail!.attachments[0]!;
    expect(att.filename).toBe(d.attachment!.fileName);
    expect(att.contentType).toBe("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
    expect(createHash("sha256").update(att.content).digest("hex")).toBe(d.attachment!.sha256);

    // The outbox's download is the same file.
    const dl = (await attachmentRoute({
      request: new Request("http://127.0.0.1/x"),
      url: new URL("http://127.0.0.1/x"),
      params: { id: d.id },
      locals: { user: consultant },
    } as never)) as Response;
    expect(dl.status).toBe(200);
    expect(dl.headers.get("content-disposition")).toContain(d.attachment!.fileName);
    expect(
      createHash("sha256")
        .update(Buffer.from(await dl.arrayBuffer()))
        .digest("hex"),
    ).toBe(d.attachment!.sha256);

    // The schedule sheet (found by its heading row), against the revision the API serves.
    const rev = (await call(revisionRoute, consultant, `/api/v1/projects/${projectId}/revisions/A`, { id: projectId, rev: "A" }))
      .body as RevisionResponse;
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(att.content as unknown as ExcelJS.Buffer);
    const text = (v: ExcelJS.CellValue) =>
      v === null || v === undefined ? "" : typeof v === "object" && "richText" in v ? v.richText.map((t) => t.text).join("") : String(v);
    let header: string[] | null = null;
    const rows: ExcelJS.CellValue[][] = [];
    for (const ws of wb.worksheets) {
      let found: string[] | null = null;
      const body: ExcelJS.CellValue[][] = [];
      ws.eachRow((row) => {
        const cells = (row.values as ExcelJS.CellValue[]).slice(1);
        const texts = cells.map(text);
        if (found) body.push(cells);
        else if (texts.some((t) => /^Façade$/.test(t)) && texts.some((t) => /^Solar transmittance τe\b/.test(t))) found = texts;
      });
      if (found) {
        header = found;
        rows.push(...body);
        break;
      }
    }
    expect(header, "a sheet with the glazing schedule's heading row").not.toBeNull();
    const h = header as unknown as string[];
    const col = (re: RegExp) => {
      const i = h.findIndex((t) => re.test(t));
      expect(i, `a column matching ${re}`).toBeGreaterThanOrEqual(0);
      return i;
    };
    const [cFacade, cOption, cTau, cG, cU] = [
      col(/^Façade$/),
      col(/^Option$/),
      col(/^Solar transmittance τe at normal incidence/),
      col(/^Total solar energy transmittance g\b/),
      col(/^Centre-of-glass U-value\b/),
    ];
    expect(rev.facades).toHaveLength(2);
    for (const f of rev.facades) {
      const row = rows.find((r) => text(r[cFacade]) === f.facadeName && text(r[cOption]) === f.optionName);
      expect(row, `a schedule row for ${f.facadeName} / ${f.optionName}`).toBeDefined();
      // The workbook carries the API's numbers (same engine run, stored in the revision): equal to the digit.
      expect(Number(row![cTau])).toBeCloseTo(f.values.normal.solarTransmittance, 10);
      expect(Number(row![cG])).toBeCloseTo(f.values.normal.gValue, 10);
      expect(Number(row![cU])).toBeCloseTo(f.values.uValue, 10);
    }
  }, 90_000);
});
