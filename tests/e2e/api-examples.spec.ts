// Every example of the API document, sent to the running app: the document is read from GET /api/v1/openapi.json,
// each operation's example request (`x-paneray-example`) is sent with its placeholder ids replaced by rows this
// test makes in an organisation of its own (so nothing other specs use changes), and the answer must have the
// documented success status and a body the documented schema accepts (ajv, draft 2020-12); files are opened
// (the workbooks with exceljs). Each example is sent by the least role its route table rule allows (client,
// architect, consultant, owner; the client sees the project because it is shared with them), so the examples
// also show who may call what. Deletions run last, after every other example.
import { expect, test } from "@playwright/test";
import Ajv2020 from "ajv/dist/2020.js";
import ExcelJS from "exceljs";
import { createHash } from "node:crypto";
import { EXAMPLE_IDS, EXAMPLE_LAYERS } from "@/lib/api-docs/examples";
import { ANONYMOUS, addMember, baseUrl, call, createOutsider, signInAs, type Caller, type Outsider } from "./api-actors";
import { ROUTES, type RouteEntry } from "@/lib/auth/route-table";
import { permissionFor, roleCan, type RoleName } from "@/lib/auth/roles";
import { uniqueEmail } from "./helpers";

test.describe.configure({ timeout: 240_000 });

type Example = {
  params?: Record<string, string>;
  query?: Record<string, string>;
  body?: unknown;
  file?: { name: string; contentType: string; text: string };
};
type Op = {
  operationId: string;
  security: unknown[];
  responses: Record<string, { content?: Record<string, { schema?: object }> }>;
  "x-paneray-example": Example;
  "x-paneray-key-scope"?: string;
};
type Doc = { paths: Record<string, Record<string, Op>>; components: { schemas: Record<string, object> } };

let doc: Doc;
let owner: Outsider;
let invitee: Outsider;
/** The owner's calculate key, used as a script would. */
let scriptKey: Caller;
const callers: Partial<Record<RoleName, Caller>> = {};
const ids: Record<string, string> = {};
/** Placeholders of one operation that name another row than elsewhere. */
const only: Record<string, Record<string, string>> = {};

const must = async (caller: Caller, method: string, path: string, body?: unknown, status = [200, 201, 202]) => {
  const res = await call(caller, method, path, body, 60_000);
  expect(status, `${method} ${path}: ${res.status} ${res.text.slice(0, 300)}`).toContain(res.status);
  return res.body as Record<string, unknown>;
};

test.beforeAll(async () => {
  test.setTimeout(180_000);
  doc = (await call(ANONYMOUS, "GET", "/api/v1/openapi.json")).body as Doc;
  owner = await createOutsider("api-examples");
  invitee = await createOutsider("api-invitee");
  const org = owner.organizationId;
  ids.organizationId = org;
  callers.owner = { ...owner, actor: "owner" };
  for (const role of ["client", "architect", "consultant"] as const) {
    const m = await addMember(owner, org, role);
    if (role === "client") ids.memberId = m.memberId;
    callers[role] = await signInAs(role, m.email, "added-member-2026");
  }
  ids.otherMemberId = (await addMember(owner, org, "architect")).memberId;
  const me = (await must(owner, "GET", "/api/v1/me")) as { user: { id: string } };
  ids.userId = me.user.id;
  ids.makeupId = (
    (await must(owner, "POST", `/api/v1/orgs/${org}/makeups`, { name: "Examples low-e argon", layers: EXAMPLE_LAYERS })) as { id: string }
  ).id;
  ids.otherMakeupId = (
    (await must(owner, "POST", `/api/v1/orgs/${org}/makeups`, { name: "Examples spare", layers: EXAMPLE_LAYERS })) as { id: string }
  ).id;
  ids.paneId = (
    (await must(owner, "POST", `/api/v1/orgs/${org}/panes`, {
      name: "Examples pane",
      layer: { thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.015 },
    })) as {
      id: string;
    }
  ).id;
  const site = { siteName: "Examples quay", latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" };
  const p = (await must(owner, "POST", "/api/v1/projects", {
    organizationId: org,
    name: "Examples project",
    ...site,
    facades: [{ name: "Ropewalk", azimuthDeg: 225 }],
  })) as {
    project: { id: string };
  };
  ids.projectId = p.project.id;
  ids.otherProjectId = (
    (await must(owner, "POST", "/api/v1/projects", { organizationId: org, name: "Examples spare project", ...site })) as { project: { id: string } }
  ).project.id;
  ids.facadeId = ((await must(owner, "GET", `/api/v1/projects/${ids.projectId}`)) as { facades: { id: string }[] }).facades[0]!.id;
  const option = async (name: string) =>
    (
      (await must(owner, "POST", `/api/v1/projects/${ids.projectId}/options`, { facadeId: ids.facadeId, makeupId: ids.makeupId, name })) as {
        option: { id: string };
      }
    ).option.id;
  await must(owner, "POST", `/api/v1/projects/${ids.projectId}/shares`, { memberId: ids.memberId });
  ids.optionId = await option("Examples option");
  ids.otherOptionId = await option("Examples approved option");
  await must(owner, "POST", `/api/v1/options/${ids.otherOptionId}/decision`, { decision: "approved" });
  await must(owner, "POST", `/api/v1/projects/${ids.projectId}/revisions`, { note: "Examples revision A", year: 2026 });
  ids.invitationId = (
    (await must(owner, "POST", `/api/v1/orgs/${org}/invitations`, { email: uniqueEmail("api-cancel"), role: "client" })) as {
      invitation: { id: string };
    }
  ).invitation.id;
  const toAccept = (
    (await must(owner, "POST", `/api/v1/orgs/${org}/invitations`, { email: invitee.email, role: "architect" })) as { invitation: { id: string } }
  ).invitation.id;
  only["postInvitationsByIdAccept"] = { [EXAMPLE_IDS.invitationId]: toAccept };
  const newKey = async (name: string, scope: string) =>
    (await must(owner, "POST", `/api/v1/orgs/${org}/api-keys`, { name, scope })) as { apiKey: { id: string }; key: string };
  ids.apiKeyId = (await newKey("Examples key to revoke", "read")).apiKey.id;
  scriptKey = { actor: "owner", cookie: null, bearer: (await newKey("Examples script key", "calculate")).key };
  ids.deliveryId = (
    (await must(owner, "POST", `/api/v1/projects/${ids.projectId}/deliveries`, { revision: "A", to: [uniqueEmail("api-delivery")] })) as {
      id: string;
    }
  ).id;
  // The attachment exists once the worker has built the workbook.
  await expect
    .poll(
      async () => ((await must(owner, "GET", `/api/v1/deliveries/${ids.deliveryId}`)) as { delivery: { attachment: unknown } }).delivery.attachment,
      { timeout: 60_000 },
    )
    .not.toBeNull();
});

/** The least role that the route's rule lets call it on a project shared with the client. */
function leastRole(route: RouteEntry): RoleName {
  const rule = route.auth;
  if (typeof rule !== "object") return "client";
  return (["client", "architect", "consultant", "owner"] as const).find((r) => !rule.permission || roleCan(r, permissionFor(rule.permission)))!;
}

/** `value` with every placeholder id replaced (in strings and in object keys). */
function substitute(value: unknown, map: Record<string, string>): unknown {
  if (typeof value === "string") return Object.entries(map).reduce((s, [from, to]) => s.split(from).join(to), value);
  if (Array.isArray(value)) return value.map((v) => substitute(v, map));
  if (value && typeof value === "object") return Object.fromEntries(Object.entries(value).map(([k, v]) => [substitute(k, map), substitute(v, map)]));
  return value;
}

test("every documented example request answers as documented", async () => {
  const ajv = new Ajv2020({ strict: false, allErrors: true, validateFormats: false });
  ajv.addSchema({ $id: "doc", components: doc.components });
  const ops = Object.entries(doc.paths).flatMap(([path, item]) =>
    Object.entries(item).map(([method, op]) => ({ path, method: method.toUpperCase(), op })),
  );
  expect(ops.length).toBeGreaterThan(50);
  const ordered = [...ops.filter((o) => o.method !== "DELETE"), ...ops.filter((o) => o.method === "DELETE")];
  const placeholders = Object.fromEntries(Object.entries(EXAMPLE_IDS).map(([k, v]) => [v, ids[k] ?? v]));
  const problems: string[] = [];
  let sent = 0;
  let validated = 0;
  let keyed = 0;
  const roles: Record<string, number> = {};
  for (const { path, method, op } of ordered) {
    const ex = op["x-paneray-example"];
    const map = { ...placeholders, ...only[op.operationId] };
    const url =
      path.replace(/\{(\w+)\}/g, (_, n: string) => encodeURIComponent(String(substitute(ex.params?.[n] ?? "", map)))) +
      (ex.query ? `?${new URLSearchParams(substitute(ex.query, map) as Record<string, string>)}` : "");
    const route = ROUTES.find((r) => r.method === method && r.path === path.replace(/\{(\w+)\}/g, ":$1"))!;
    const role = leastRole(route);
    const caller = op.operationId === "postInvitationsByIdAccept" ? invitee : op.security.length === 0 ? ANONYMOUS : callers[role]!;
    roles[caller.actor] = (roles[caller.actor] ?? 0) + 1;
    const [status, success] = Object.entries(op.responses).find(([s]) => Number(s) < 400)!;
    let body: unknown = ex.body === undefined ? undefined : substitute(ex.body, map);
    const key = `${method} ${path}`;
    const binary = success.content && !success.content["application/json"];
    /** Sends the example as `who`; a problem in words, or null when the answer is as documented. */
    const check = async (who: Caller, as: string): Promise<string | null> => {
      if (ex.file) {
        const form = new FormData();
        form.append("file", new Blob([ex.file.text], { type: ex.file.contentType }), ex.file.name);
        body = form;
      }
      sent++;
      if (binary) {
        const headers: Record<string, string> = who.bearer ? { authorization: `Bearer ${who.bearer}` } : { cookie: who.cookie ?? "" };
        const res = await fetch(baseUrl() + url, { headers, signal: AbortSignal.timeout(60_000) });
        const bytes = Buffer.from(await res.arrayBuffer());
        const type = Object.keys(success.content!)[0]!;
        if (String(res.status) !== status || !res.headers.get("content-type")?.startsWith(type.split(";")[0]!))
          return `${key} ${as}: ${res.status} ${res.headers.get("content-type")} ${bytes.toString("utf8", 0, 200)}`;
        if (type.includes("spreadsheetml")) {
          const wb = new ExcelJS.Workbook();
          await wb.xlsx.load(bytes as unknown as ArrayBuffer);
          expect(wb.worksheets.length, key).toBeGreaterThan(0);
        } else expect(bytes.toString("utf8").split(/\r?\n/)[0]!.split(",").length, key).toBeGreaterThan(1);
        const sha = res.headers.get("x-content-sha256");
        if (sha) expect(sha, key).toBe(createHash("sha256").update(bytes).digest("hex"));
        return null;
      }
      const res = await call(who, method, url, body, 60_000);
      if (String(res.status) !== status) return `${key} ${as}: expected ${status}, got ${res.status} ${res.text.slice(0, 300)}`;
      const schema = success.content?.["application/json"]?.schema;
      if (!schema) return res.text === "" ? null : `${key} ${as}: expected no body, got ${res.text.slice(0, 100)}`;
      const validate = ajv.compile(JSON.parse(JSON.stringify(schema).replace(/"#\/components\//g, '"doc#/components/')));
      return validate(res.body) ? null : `${key} ${as}: ${ajv.errorsText(validate.errors?.slice(0, 5))}`;
    };
    const problem = await check(caller, caller.actor);
    if (problem) problems.push(problem);
    else validated++;
    // What a script does with a key: every example a calculate key may send (reads and the calculations) again,
    // with the key alone (no cookie, no Origin).
    const scope = op["x-paneray-key-scope"];
    if ((scope === "read" || scope === "calculate") && method !== "DELETE") {
      const byKey = await check(scriptKey, "with a calculate key");
      if (byKey) problems.push(byKey);
      else keyed++;
    }
  }
  console.log(
    `api examples: ${sent} requests sent; ${validated} of ${ops.length} examples answered as documented, and ${keyed} of them again with an API key; callers ${JSON.stringify(roles)}`,
  );
  expect(problems).toEqual([]);
  expect(validated).toBe(ops.length);
  expect(keyed, "the calculation routes, the results, revisions and workbooks answer a key").toBeGreaterThan(25);
});

test.afterAll(async () => {
  if (ids.projectId) await call(owner, "DELETE", `/api/v1/projects/${ids.projectId}`);
});
