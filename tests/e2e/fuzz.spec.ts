// Fuzzing of every route that reads a JSON body, against the built app: bodies generated from the routes' zod
// contracts (through their JSON Schema), with hostile values mixed in at any depth (NUL and other control
// characters, lone surrogates, 300 KB strings, bidirectional marks, SQL and HTML fragments, `__proto__` keys,
// deep nesting, NaN/Infinity spelled as strings, wrong types) and hostile whole bodies. Every answer must come
// within the per-request timeout and below 500, and a refused request (4xx) must leave every table as it was.
// Runs as the owner of an organisation of its own, so that accepted writes change nothing other tests use.
// FC_SEED sets the seed (fixed by default, so CI runs the same cases), FUZZ_RUNS the runs per route.
import { expect, test } from "@playwright/test";
import fc from "fast-check";
import pg from "pg";
import { z } from "zod";
import { ROUTES } from "@/lib/auth/route-table";
import { SignUpRequest, InvitationRequest, MemberRoleRequest } from "@/lib/contracts/auth";
import { GlazingRequest } from "@/lib/contracts/glazing";
import { ProjectCreateRequest, ProjectUpdateRequest, ShareRequest } from "@/lib/contracts/projects";
import { ScheduleRequest } from "@/lib/contracts/schedule";
import { RevisionIssueRequest } from "@/lib/contracts/revisions";
import { MakeupCreateRequest, MakeupPatchRequest, PaneCreateRequest, PanePatchRequest } from "@/lib/contracts/library";
import { OptionCreateRequest, OptionPatchRequest } from "@/lib/contracts/options";
import { RequirementsRequest } from "@/lib/contracts/requirements";
import { baseUrl, call, createOutsider, type Outsider } from "./api-actors";
import { CommentRequest, DecisionRequest } from "@/lib/contracts/review";
import { DeliveryRequest } from "@/lib/contracts/deliveries";
import { ApiKeyCreateRequest } from "@/lib/contracts/api-keys";
import { OPERATIONS } from "@/lib/api-docs/operations";
import { EXAMPLE_IDS } from "@/lib/api-docs/examples";

const SEED = Number(process.env.FC_SEED ?? 20261202);
const RUNS = Number(process.env.FUZZ_RUNS ?? 25);
const REQUEST_TIMEOUT_MS = 20_000;

test.describe.configure({ timeout: 120_000 });

// ---- arbitraries from JSON Schema ------------------------------------------------------------------------------

type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  minItems?: number;
  maxItems?: number;
  minLength?: number;
  maxLength?: number;
  pattern?: string;
  enum?: unknown[];
  const?: unknown;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  minimum?: number;
  maximum?: number;
};

const HOSTILE_STRINGS = [
  "\u0000",
  "name\u0000with NUL",
  "\u0001\u0007\u001b[31m",
  "\uD800",
  "lone \uDFFF surrogate",
  "\u202Eevil\u202C",
  "\u200F\u200E\u2066",
  "x".repeat(300 * 1024),
  "'; DROP TABLE project; --",
  "1' OR '1'='1",
  "<script>alert(1)</script>",
  '"><img src=x onerror=alert(1)>',
  "NaN",
  "Infinity",
  "-Infinity",
  "1e309",
  "",
  "   ",
  "%00",
  "../../etc/passwd",
  "\uFEFF",
  "\r\n\r\nX-Injected: 1",
];
const HOSTILE_VALUES: unknown[] = [null, true, false, 0, -0, -1, 1e308, -1e308, 2 ** 53 + 1, 0.1 + 0.2, [], {}, [null], { a: 1 }, "0", "1"];

/** Ordinary text with one character that has no business in a field: controls, a lone surrogate, bidi overrides. */
const spiked = fc
  .tuple(
    fc.string({ maxLength: 12 }),
    fc.constantFrom("\u0000", "\u0008", "\u001b", "\u007f", "\uD83D", "\uDE00", "\u202E", "\u2028", "\uFFFF"),
    fc.string({ maxLength: 12 }),
  )
  .map(([a, c, b]) => a + c + b);
const hostile = fc.oneof(
  { arbitrary: fc.constantFrom(...HOSTILE_STRINGS), weight: 2 },
  { arbitrary: spiked, weight: 2 },
  { arbitrary: fc.constantFrom(...HOSTILE_VALUES), weight: 1 },
  { arbitrary: fc.string({ unit: "binary", maxLength: 40 }), weight: 1 },
);

/** An object with an own `__proto__` (or `constructor`) key, as JSON.parse makes from a body. */
const withPoisonKey = (obj: Record<string, unknown>, key: string, value: unknown) => {
  const out = { ...obj };
  Object.defineProperty(out, key, { value, enumerable: true, configurable: true, writable: true });
  return out;
};

/** Realistic values for fields whose checks JSON Schema cannot carry (refinements, unions of layer kinds). */
function hints(ctx: Ctx): Record<string, fc.Arbitrary<unknown>> {
  const pane = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
  const gap = { kind: "gap", widthMm: 16, gas: "air" };
  const day = fc.date({ min: new Date("2025-01-01"), max: new Date("2027-12-31"), noInvalidDate: true }).map((d) => d.toISOString().slice(0, 10));
  return {
    timeZone: fc.constantFrom("UTC", "Europe/Lisbon", "America/New_York", "Asia/Kolkata", "Not/AZone"),
    organizationId: fc.constant(ctx.outsider.organizationId),
    memberId: fc.constant(ctx.memberId),
    facadeId: fc.constant(ctx.facadeId),
    makeupId: fc.constant(ctx.makeupId),
    layer: fc.constant(pane),
    email: fc.tuple(fc.stringMatching(/^[a-z0-9]{1,16}$/), fc.nat()).map(([local, n]) => `fuzz.${local}.${n}@e2e.example`),
    layers: fc.constantFrom([pane], [pane, gap, pane], [pane, { ...gap, gas: "argon" }, pane, gap, pane]),
    surfaces: fc.array(
      fc.record({
        name: fc.string({ minLength: 1, maxLength: 20 }),
        azimuthDeg: fc.integer({ min: 0, max: 360 }),
        tiltDeg: fc.integer({ min: 0, max: 180 }),
        layers: fc.constant([pane, gap, pane]),
      }),
      { minLength: 1, maxLength: 3 },
    ),
    from: day,
    to: day,
    latitudeDeg: fc.double({ min: -90, max: 90, noNaN: true }),
    longitudeDeg: fc.double({ min: -180, max: 180, noNaN: true }),
    azimuthDeg: fc.double({ min: 0, max: 360, noNaN: true }),
    password: fc.string({ minLength: 8, maxLength: 40 }),
  };
}

interface Ctx {
  outsider: Outsider;
  memberId: string;
  /** The fuzz organisation's saved make-up, saved pane, and the fuzz project's façade and option. */
  makeupId: string;
  paneId: string;
  facadeId: string;
  optionId: string;
}

/** Values a JSON Schema allows, with hostile values in place of some of them when `mixed`. */
function fromSchema(schema: JsonSchema, ctx: Ctx, mixed: boolean, depth = 0, key?: string): fc.Arbitrary<unknown> {
  const h = key ? hints(ctx)[key] : undefined;
  const plain = plainFromSchema(schema, ctx, mixed, depth);
  const good = h ? (mixed ? fc.oneof(h, plain) : h) : plain;
  return mixed ? fc.oneof({ arbitrary: good, weight: 6 }, { arbitrary: hostile, weight: 1 }) : good;
}

/** Every place in a JSON value where another value could go: [] is the value itself. */
function placesIn(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  const out = [path];
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...placesIn(v, [...path, i])));
  else if (value && typeof value === "object") for (const [k, v] of Object.entries(value)) out.push(...placesIn(v, [...path, k]));
  return out;
}

const valueAt = (value: unknown, path: (string | number)[]): unknown =>
  path.reduce<unknown>((v, k) => (v && typeof v === "object" ? (v as Record<string | number, unknown>)[k] : undefined), value);

/** `value` with the value at `path` replaced (a copy; the rest shared). */
function replaceAt(value: unknown, path: (string | number)[], by: unknown): unknown {
  if (path.length === 0) return by;
  const [head, ...rest] = path;
  if (Array.isArray(value)) return value.map((v, i) => (i === head ? replaceAt(v, rest, by) : v));
  const obj = value as Record<string, unknown>;
  return { ...obj, [head!]: replaceAt(obj[head!], rest, by) };
}

/** A valid-looking body with exactly one value replaced by a hostile one, or one poisoned key added. */
const oneHostileValue = (valid: fc.Arbitrary<unknown>) =>
  fc
    .tuple(valid, fc.nat(), fc.boolean(), hostile, fc.nat(4), fc.constantFrom("__proto__", "constructor", "prototype"))
    .map(([body, pick, textOnly, bad, poisonDie, key]) => {
      // Half of the time the hostile value replaces text, where stored strings come from.
      const all = placesIn(body).slice(1);
      const texts = all.filter((p) => typeof valueAt(body, p) === "string");
      const places = textOnly && texts.length ? texts : all;
      const place = places[pick % Math.max(1, places.length)] ?? [];
      if (poisonDie === 0 && body && typeof body === "object" && !Array.isArray(body))
        return withPoisonKey(body as Record<string, unknown>, key, { polluted: true });
      return replaceAt(body, place, bad);
    });

function plainFromSchema(s: JsonSchema, ctx: Ctx, mixed: boolean, depth: number): fc.Arbitrary<unknown> {
  if (s.const !== undefined) return fc.constant(s.const);
  if (s.enum) return fc.constantFrom(...s.enum);
  const alts = s.anyOf ?? s.oneOf;
  if (alts) return fc.oneof(...alts.map((a) => plainFromSchema(a, ctx, mixed, depth)));
  if (s.allOf?.length) return plainFromSchema(s.allOf[0]!, ctx, mixed, depth);
  const type = Array.isArray(s.type) ? s.type[0] : s.type;
  switch (type) {
    case "object": {
      const props = Object.entries(s.properties ?? {});
      const required = new Set(s.required ?? []);
      const record = fc.record(Object.fromEntries(props.map(([k, v]) => [k, fromSchema(v, ctx, mixed, depth + 1, k)])), {
        requiredKeys: props.map(([k]) => k).filter((k) => required.has(k)),
      }) as fc.Arbitrary<Record<string, unknown>>;
      if (!mixed) return record;
      return fc.oneof(
        { arbitrary: record, weight: 8 },
        {
          arbitrary: fc
            .tuple(
              record,
              fc.constantFrom("__proto__", "constructor", "prototype"),
              fc.constantFrom<unknown>({ polluted: true }, { isAdmin: true }, null),
            )
            .map(([o, k, v]) => withPoisonKey(o, k, v)),
          weight: 1,
        },
        { arbitrary: fc.tuple(record, fc.string({ maxLength: 12 }), hostile).map(([o, k, v]) => ({ ...o, [k]: v })), weight: 1 },
      );
    }
    case "array": {
      if (depth > 4) return fc.constant([]);
      const items = s.items && Object.keys(s.items).length ? fromSchema(s.items, ctx, mixed, depth + 1) : hostile;
      return fc.array(items, {
        minLength: Math.min(s.minItems ?? 0, 12),
        maxLength: Math.min(s.maxItems ?? 8, s.minItems ? Math.max(s.minItems, 12) : 8),
      });
    }
    case "string":
      if (s.pattern) return fc.stringMatching(new RegExp(s.pattern));
      return fc.string({ minLength: s.minLength ?? 0, maxLength: Math.min(s.maxLength ?? 80, 300), unit: "grapheme" });
    case "integer":
      return mixed ? fc.oneof(fc.integer({ min: -100, max: 10_000 }), fc.integer()) : fc.constantFrom(15, 30, 60);
    case "number":
      return mixed ? fc.oneof(fc.double({ min: -1000, max: 1000, noNaN: true }), fc.double({ noNaN: true })) : fc.integer({ min: 0, max: 60 });
    case "boolean":
      return fc.boolean();
    case "null":
      return fc.constant(null);
    default:
      return fc.oneof(hostile, fc.jsonValue({ maxDepth: 2 }));
  }
}

/** A valid-looking body with one control or otherwise unwelcome character put into one of its texts. */
const CONTROL = fc.oneof(
  { arbitrary: fc.constant("\u0000"), weight: 3 },
  { arbitrary: fc.constantFrom("\u0001", "\u0008", "\u001b", "\u007f", "\uD800", "\u202E"), weight: 6 },
);
const oneSpikedText = (valid: fc.Arbitrary<unknown>) =>
  fc.tuple(valid, fc.nat(), fc.nat(), CONTROL).map(([body, pick, at, c]) => {
    const texts = placesIn(body).filter((p) => p.length > 0 && typeof valueAt(body, p) === "string");
    if (!texts.length) return body;
    const place = texts[pick % texts.length]!;
    const text = valueAt(body, place) as string;
    const i = at % (text.length + 1);
    return replaceAt(body, place, text.slice(0, i) + c + text.slice(i));
  });

/** Whole bodies no schema describes: broken JSON, deep nesting, wrong top-level types, raw bytes. */
const HOSTILE_BODIES: fc.Arbitrary<string | Uint8Array> = fc.constantFrom<string | Uint8Array>(
  "",
  "null",
  "[]",
  '"just a string"',
  "12",
  "{",
  '{"a":',
  "[".repeat(20_000) + "]".repeat(20_000),
  '{"a":'.repeat(5_000) + "1" + "}".repeat(5_000),
  '{"__proto__":{"polluted":true},"constructor":{"prototype":{"polluted":true}}}',
  JSON.stringify({ name: "x".repeat(300 * 1024) }),
  new Uint8Array([0x7b, 0x22, 0x6e, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0xc0, 0xaf, 0x22, 0x7d]),
  "NaN",
  '{"latitudeDeg": NaN, "longitudeDeg": Infinity}',
);

// ---- the routes ------------------------------------------------------------------------------------------------

interface FuzzRoute {
  method: "POST" | "PATCH" | "PUT";
  path: string;
  schema: z.ZodType;
  url: (ctx: Ctx) => string;
}

/**
 * A valid body: the route's example in the API document (src/lib/api-docs/operations.ts) with its placeholder ids
 * replaced by the fuzz organisation's rows and its e-mail addresses by fresh ones. The base for generated bodies
 * the schema refuses for reasons other than the hostile value.
 */
function documentedExample(route: Pick<FuzzRoute, "method" | "path">, c: Ctx): unknown {
  const op = OPERATIONS.find((o) => o.method === route.method && o.path === route.path);
  if (!op || op.example.body === undefined) throw new Error(`${route.method} ${route.path} has no example body in the API document`);
  const ids: Record<string, string> = {
    [EXAMPLE_IDS.organizationId]: c.outsider.organizationId,
    [EXAMPLE_IDS.memberId]: c.memberId,
    [EXAMPLE_IDS.otherMemberId]: c.memberId,
    [EXAMPLE_IDS.makeupId]: c.makeupId,
    [EXAMPLE_IDS.paneId]: c.paneId,
    [EXAMPLE_IDS.facadeId]: c.facadeId,
    [EXAMPLE_IDS.optionId]: c.optionId,
    [EXAMPLE_IDS.otherOptionId]: c.optionId,
  };
  const swap = (v: unknown): unknown =>
    typeof v === "string"
      ? (ids[v] ?? (/^[^@\s]+@[^@\s]+\.example$/.test(v) ? freshEmail() : v))
      : Array.isArray(v)
        ? v.map(swap)
        : v && typeof v === "object"
          ? Object.fromEntries(Object.entries(v).map(([k, x]) => [ids[k] ?? k, swap(x)]))
          : v;
  return swap(op.example.body);
}

let emails = 0;
const freshEmail = () => `fuzz.example-${SEED}-${++emails}@e2e.example`;
const pane = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const gap = { kind: "gap", widthMm: 16, gas: "air" };

const FUZZED: FuzzRoute[] = [
  {
    method: "POST",
    path: "/api/v1/signup",
    schema: SignUpRequest,
    url: () => "/api/v1/signup",
  },
  {
    method: "POST",
    path: "/api/v1/calc/glazing",
    schema: GlazingRequest,
    url: () => "/api/v1/calc/glazing",
  },
  {
    method: "POST",
    path: "/api/v1/calc/schedule",
    schema: ScheduleRequest,
    url: () => "/api/v1/calc/schedule",
  },
  { method: "POST", path: "/api/v1/projects", schema: ProjectCreateRequest, url: () => "/api/v1/projects" },
  {
    method: "PATCH",
    path: "/api/v1/projects/:id",
    schema: ProjectUpdateRequest,
    url: () => `/api/v1/projects/${projectId}`,
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/shares",
    schema: ShareRequest,
    url: () => `/api/v1/projects/${projectId}/shares`,
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/invitations",
    schema: InvitationRequest,
    url: (c) => `/api/v1/orgs/${c.outsider.organizationId}/invitations`,
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/api-keys",
    schema: ApiKeyCreateRequest,
    url: (c) => `/api/v1/orgs/${c.outsider.organizationId}/api-keys`,
  },
  {
    method: "PATCH",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    schema: MemberRoleRequest,
    url: (c) => `/api/v1/orgs/${c.outsider.organizationId}/members/${c.memberId}`,
  },
  {
    // The fuzz target has no approved option: a valid body is answered 409 and nothing is saved either way.
    method: "POST",
    path: "/api/v1/projects/:id/revisions",
    schema: RevisionIssueRequest,
    url: () => `/api/v1/projects/${projectId}/revisions`,
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/makeups",
    schema: MakeupCreateRequest,
    url: (c) => `/api/v1/orgs/${c.outsider.organizationId}/makeups`,
  },
  {
    // Valid bodies name revision 1, stale once the first is accepted: 409, and nothing saved.
    method: "PATCH",
    path: "/api/v1/makeups/:id",
    schema: MakeupPatchRequest,
    url: (c) => `/api/v1/makeups/${c.makeupId}`,
  },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/panes",
    schema: PaneCreateRequest,
    url: (c) => `/api/v1/orgs/${c.outsider.organizationId}/panes`,
  },
  {
    method: "PATCH",
    path: "/api/v1/panes/:id",
    schema: PanePatchRequest,
    url: (c) => `/api/v1/panes/${c.paneId}`,
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/options",
    schema: OptionCreateRequest,
    url: () => `/api/v1/projects/${projectId}/options`,
  },
  {
    method: "PATCH",
    path: "/api/v1/options/:id",
    schema: OptionPatchRequest,
    url: (c) => `/api/v1/options/${c.optionId}`,
  },
  {
    method: "PUT",
    path: "/api/v1/projects/:id/requirements",
    schema: RequirementsRequest,
    url: () => `/api/v1/projects/${projectId}/requirements`,
  },
  {
    method: "POST",
    path: "/api/v1/options/:id/comments",
    schema: CommentRequest,
    url: (c) => `/api/v1/options/${c.optionId}/comments`,
  },
  {
    method: "POST",
    path: "/api/v1/options/:id/decision",
    schema: DecisionRequest,
    url: (c) => `/api/v1/options/${c.optionId}/decision`,
  },
  {
    // The fuzz target has no issued revision: a valid body is answered 400 naming `revision`, nothing is queued.
    method: "POST",
    path: "/api/v1/projects/:id/deliveries",
    schema: DeliveryRequest,
    url: () => `/api/v1/projects/${projectId}/deliveries`,
  },
];

let ctx: Ctx;
let projectId: string;
let db: pg.Client;

/**
 * Row counts of every table (sessions and verification tokens aside: signing in makes those; and the results
 * cache, which a draft workbook's query fills when it computes the draft's results).
 */
async function counts(): Promise<Record<string, number>> {
  const tables = (
    await db.query("select tablename from pg_tables where schemaname = 'public' and tablename not like '%drizzle%' order by 1")
  ).rows.map((r: { tablename: string }) => r.tablename);
  const out: Record<string, number> = {};
  for (const t of tables.filter((t) => t !== "session" && t !== "verification" && t !== "result_cache"))
    out[t] = Number((await db.query(`select count(*)::int as n from "${t}"`)).rows[0].n);
  return out;
}

const show = (body: unknown) => {
  const s = typeof body === "string" ? body : body instanceof Uint8Array ? `bytes ${[...body].join(",")}` : JSON.stringify(body);
  return s.length > 300 ? `${s.slice(0, 300)}… (${s.length} chars)` : s;
};

test.beforeAll(async () => {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: run the tests through npm test");
  db = new pg.Client({ connectionString: url });
  await db.connect();
  const outsider = await createOutsider("fuzz-owner");
  const members = (await call(outsider, "GET", `/api/v1/orgs/${outsider.organizationId}/members`)).body as { members: { memberId: string }[] };
  const p = await call(outsider, "POST", "/api/v1/projects", {
    organizationId: outsider.organizationId,
    name: "Fuzz target",
    siteName: "Fuzz site",
    latitudeDeg: 10,
    longitudeDeg: 10,
    timeZone: "UTC",
    facades: [{ name: "South", azimuthDeg: 180 }],
  });
  expect(p.status).toBe(201);
  projectId = (p.body as { project: { id: string } }).project.id;
  const facadeId = ((await call(outsider, "GET", `/api/v1/projects/${projectId}`)).body as { facades: { id: string }[] }).facades[0]!.id;
  const mk = await call(outsider, "POST", `/api/v1/orgs/${outsider.organizationId}/makeups`, { name: "Fuzz make-up", layers: [pane, gap, pane] });
  expect(mk.status, mk.text.slice(0, 200)).toBe(201);
  const makeupId = (mk.body as { id: string }).id;
  const pn = await call(outsider, "POST", `/api/v1/orgs/${outsider.organizationId}/panes`, { name: "Fuzz pane", layer: pane });
  expect(pn.status, pn.text.slice(0, 200)).toBe(201);
  const op = await call(outsider, "POST", `/api/v1/projects/${projectId}/options`, { facadeId, makeupId, name: "Fuzz option" });
  expect(op.status, op.text.slice(0, 200)).toBe(201);
  ctx = {
    outsider,
    memberId: members.members[0]!.memberId,
    makeupId,
    paneId: (pn.body as { id: string }).id,
    facadeId,
    optionId: (op.body as { option: { id: string } }).option.id,
  };
});

test.afterAll(async () => {
  await db?.end();
});

test("every route that reads a body is fuzzed", () => {
  const bodyRoutes = ROUTES.filter((r) => r.method === "POST" || r.method === "PATCH" || r.method === "PUT").filter((r) => r.auth !== "better-auth");
  const withoutBody = ["POST /api/v1/invitations/:id/accept"];
  const fuzzed = new Set([...FUZZED, ...UPLOADS].map((r) => `${r.method} ${r.path}`));
  expect(bodyRoutes.map((r) => `${r.method} ${r.path}`).filter((k) => !fuzzed.has(k) && !withoutBody.includes(k))).toEqual([]);
});

for (const route of FUZZED) {
  test(`${route.method} ${route.path} never fails or saves a refused body`, async () => {
    const jsonSchema = z.toJSONSchema(route.schema, { io: "input", unrepresentable: "any" }) as JsonSchema;
    // Generated bodies the schema accepts, or else the route's example: a hostile value then lands in a body
    // that would otherwise be accepted.
    const valid = fromSchema(jsonSchema, ctx, false).map((b) => (route.schema.safeParse(b).success ? b : documentedExample(route, ctx)));
    const json = (a: fc.Arbitrary<unknown>) => a.map((b) => JSON.stringify(b) ?? "null");
    const bodies = fc.oneof(
      { arbitrary: json(valid), weight: 2 },
      { arbitrary: json(oneHostileValue(valid)), weight: 6 },
      { arbitrary: json(oneSpikedText(valid)), weight: 3 },
      { arbitrary: json(fromSchema(jsonSchema, ctx, true)), weight: 2 },
      { arbitrary: HOSTILE_BODIES, weight: 1 },
    );
    const statuses: Record<number, number> = {};
    await fc.assert(
      fc.asyncProperty(bodies, async (body) => {
        const before = await counts();
        let res;
        try {
          res = await call(ctx.outsider, route.method, route.url(ctx), body, REQUEST_TIMEOUT_MS);
        } catch (err) {
          throw new Error(`no answer within ${REQUEST_TIMEOUT_MS} ms (${(err as Error).message}) for ${show(body)}`);
        }
        statuses[res.status] = (statuses[res.status] ?? 0) + 1;
        if (res.status >= 500) throw new Error(`answered ${res.status} ${res.text.slice(0, 200)} for ${show(body)}`);
        if (res.status >= 400) {
          expect(res.headers.get("content-type") ?? "", `${res.status} for ${show(body)}`).toContain("application/problem+json");
          expect(await counts(), `a refused body (${res.status}) changed stored rows: ${show(body)}`).toEqual(before);
        }
      }),
      { seed: SEED, numRuns: RUNS, interruptAfterTimeLimit: 90_000, markInterruptAsFailure: false },
    );
    test.info().annotations.push({ type: "statuses", description: JSON.stringify(statuses) });
    if (process.env.FUZZ_VERBOSE) console.log(`${route.method} ${route.path}: answers ${JSON.stringify(statuses)}`);
  });
}

// The workbook downloads read no body but a query string: hostile values in each parameter. Every answer comes
// within the timeout and below 500, refusals are problem+json, and nothing is ever stored.
const QUERY_FUZZED = [
  { path: "/api/v1/projects/:id/workbook", url: () => `/api/v1/projects/${projectId}/workbook`, keys: ["revision", "year"] },
  {
    path: "/api/v1/projects/:id/workbook.csv",
    url: () => `/api/v1/projects/${projectId}/workbook.csv`,
    keys: ["revision", "year", "table", "facadeId"],
  },
];

test("every GET route with a query of its own is fuzzed", () => {
  const fuzzed = new Set(QUERY_FUZZED.map((q) => q.path));
  expect(
    ROUTES.filter((r) => r.method === "GET" && r.path.includes("/workbook"))
      .map((r) => r.path)
      .filter((p) => !fuzzed.has(p)),
  ).toEqual([]);
});

for (const route of QUERY_FUZZED) {
  test(`GET ${route.path} never fails on a hostile query`, async () => {
    const value = fc.oneof(
      fc.constantFrom("A", "Z", "a", "AAAAA", "2026", "schedule", "hourly", "angles", "cover", ctx.facadeId, ""),
      fc.constantFrom(...HOSTILE_STRINGS.map((s) => s.slice(0, 2000))),
      spiked,
    );
    const queries = fc.dictionary(fc.constantFrom(...route.keys), value, { maxKeys: route.keys.length });
    const before = await counts();
    await fc.assert(
      fc.asyncProperty(queries, async (q) => {
        const search = new URLSearchParams(q as Record<string, string>).toString();
        const res = await call(ctx.outsider, "GET", `${route.url()}${search ? `?${search}` : ""}`, undefined, REQUEST_TIMEOUT_MS);
        if (res.status >= 500) throw new Error(`answered ${res.status} ${res.text.slice(0, 200)} for ?${search}`);
        if (res.status >= 400) expect(res.headers.get("content-type") ?? "", `${res.status} for ?${search}`).toContain("application/problem+json");
      }),
      { seed: SEED, numRuns: RUNS, interruptAfterTimeLimit: 90_000, markInterruptAsFailure: false },
    );
    expect(await counts()).toEqual(before);
  });
}

// ---- multipart uploads ----------------------------------------------------------------------------------------
// The upload routes read a CSV file from multipart/form-data, not JSON: they get files whose header is right and
// whose cells are hostile, files of hostile bytes, and broken multipart bodies (no boundary, a boundary that never
// closes, a wrong field name, two files, headers only).

const UPLOADS = [
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/panes/import",
    url: (c: Ctx) => `/api/v1/orgs/${c.outsider.organizationId}/panes/import`,
    header: "name,thickness_mm,solar_t,solar_rf,solar_rb,light_t,light_rf,light_rb,emissivity_front,emissivity_back,note",
    valid: ["Fuzzed pane", "6", "0.8", "0.07", "0.07", "", "", "", "", "", "note"],
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/weather",
    url: () => `/api/v1/projects/${projectId}/weather`,
    header: "time,ghi_wm2,dni_wm2,dhi_wm2,air_temperature_c",
    valid: ["2026-06-21T10:00Z", "700", "650", "150", "21"],
  },
] as const;

const csvCell = fc.oneof(
  fc.constantFrom(...HOSTILE_STRINGS.filter((x) => x.length < 1000)),
  spiked,
  fc.constantFrom("0", "-1", "1e309", "NaN", "0,5", "2026-13-40T25:61Z", "2026-03-29 02:30", '"', '""', "\r", "\n"),
  fc.double({ noNaN: false }).map(String),
);

const boundary = "----fuzz-boundary";
const part = (name: string, fileName: string | null, content: string) =>
  `--${boundary}\r\ncontent-disposition: form-data; name="${name}"${fileName === null ? "" : `; filename="${fileName}"`}\r\ncontent-type: text/csv\r\n\r\n${content}\r\n`;

for (const route of UPLOADS) {
  test(`${route.method} ${route.path} never fails or saves a refused upload`, async () => {
    const rows = fc.array(
      fc.tuple(fc.nat({ max: route.valid.length - 1 }), csvCell).map(([i, v]) => route.valid.map((x, k) => (k === i ? v : x))),
      { minLength: 1, maxLength: 5 },
    );
    const csvText = rows.map((rs) =>
      [route.header, ...rs.map((r) => r.map((c) => (/[",\r\n]/.test(c) ? `"${c.replace(/"/g, '""')}"` : c)).join(","))].join("\n"),
    );
    const fileName = fc.oneof(fc.constant("fuzz.csv"), fc.constantFrom(...HOSTILE_STRINGS.filter((x) => x.length < 1000)), spiked);
    type Body = { kind: "form"; text: string; name: string } | { kind: "raw"; body: string; type: string };
    const bodies: fc.Arbitrary<Body> = fc.oneof(
      { arbitrary: fc.tuple(csvText, fileName).map(([text, name]): Body => ({ kind: "form", text, name })), weight: 6 },
      { arbitrary: fc.string({ maxLength: 300 }).map((text): Body => ({ kind: "form", text, name: "fuzz.csv" })), weight: 2 },
      {
        arbitrary: fc
          .tuple(csvText, fc.constantFrom("no-end", "wrong-field", "two-files", "no-filename", "headers-only", "no-boundary"))
          .map(([text, how]): Body => {
            const type = how === "no-boundary" ? "multipart/form-data" : `multipart/form-data; boundary=${boundary}`;
            const body =
              how === "no-end"
                ? `--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="x.csv"\r\n\r\n${text}`
                : how === "wrong-field"
                  ? part("upload", "x.csv", text) + `--${boundary}--\r\n`
                  : how === "two-files"
                    ? part("file", "a.csv", text) + part("file", "b.csv", text) + `--${boundary}--\r\n`
                    : how === "no-filename"
                      ? part("file", null, text) + `--${boundary}--\r\n`
                      : how === "headers-only"
                        ? `--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="x.csv"\r\n`
                        : part("file", "x.csv", text) + `--${boundary}--\r\n`;
            return { kind: "raw", body, type };
          }),
        weight: 2,
      },
    );
    const statuses: Record<number, number> = {};
    await fc.assert(
      fc.asyncProperty(bodies, async (b) => {
        const before = await counts();
        let res: Response;
        const headers: Record<string, string> = { origin: new URL(baseUrl()).origin, cookie: ctx.outsider.cookie!, accept: "application/json" };
        let body: BodyInit;
        if (b.kind === "form") {
          body = new FormData();
          body.set("file", new Blob([b.text], { type: "text/csv" }), b.name);
        } else {
          headers["content-type"] = b.type;
          body = b.body;
        }
        try {
          res = await fetch(baseUrl() + route.url(ctx), { method: "POST", headers, body, signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS) });
        } catch (err) {
          throw new Error(`no answer within ${REQUEST_TIMEOUT_MS} ms (${(err as Error).message}) for ${show(b)}`);
        }
        const text = await res.text();
        statuses[res.status] = (statuses[res.status] ?? 0) + 1;
        if (res.status >= 500) throw new Error(`answered ${res.status} ${text.slice(0, 200)} for ${show(b)}`);
        if (res.status >= 400) {
          expect(res.headers.get("content-type") ?? "", `${res.status} for ${show(b)}`).toContain("application/problem+json");
          expect(await counts(), `a refused upload (${res.status}) changed stored rows: ${show(b)}`).toEqual(before);
        }
      }),
      { seed: SEED, numRuns: RUNS, interruptAfterTimeLimit: 90_000, markInterruptAsFailure: false },
    );
    test.info().annotations.push({ type: "statuses", description: JSON.stringify(statuses) });
    if (process.env.FUZZ_VERBOSE) console.log(`${route.method} ${route.path}: answers ${JSON.stringify(statuses)}`);
  });
}
