// The API document (src/lib/api-docs): every route under /api/v1 — each row of the route table and each method
// exported by a file under src/pages/api/v1 — has an operation with the row's success status and an example;
// the document is structurally OpenAPI 3.1 (checked here: the published meta-schema is not available offline),
// every JSON Schema in it compiles with ajv's draft 2020-12 validator, and every example fits its schemas.
import { readdirSync, readFileSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import Ajv2020 from "ajv/dist/2020.js";
import { keyScope, ROUTES, routeKey } from "@/lib/auth/route-table";
import { OPERATIONS, TAGS, operationKey, pathParams } from "@/lib/api-docs/operations";
import { buildOpenApi, documentedRoutes, DIALECT, type JsonSchema, type OpenApiOperation } from "@/lib/api-docs/openapi";
import { exportedMethods } from "./fixtures/route-files";

const doc = buildOpenApi();
const V1 = join(import.meta.dirname, "../../src/pages/api/v1");
const files = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? files(join(dir, e.name)) : /\.ts$/.test(e.name) ? [join(dir, e.name)] : [],
  );

const openPath = (p: string) => p.replace(/:(\w+)/g, "{$1}");
const opAt = (method: string, path: string) => doc.paths[openPath(path)]?.[method.toLowerCase()] as OpenApiOperation | undefined;

/** ajv for draft 2020-12, strict about keywords; formats are annotations here (zod's patterns carry the checks). */
export function newAjv() {
  const ajv = new Ajv2020({ strict: true, strictRequired: false, strictTypes: false, allErrors: true, validateFormats: false });
  ajv.addKeyword("x-paneray-columns");
  ajv.addKeyword("components");
  ajv.addSchema({ $id: "doc", components: doc.components }, "doc");
  return ajv;
}
/** A schema of the document with its component references resolved through ajv's copy of the document. */
const resolvable = (schema: JsonSchema) => JSON.parse(JSON.stringify(schema).replace(/"#\/components\//g, '"doc#/components/')) as JsonSchema;

describe("every route under /api/v1 is documented", () => {
  it("each route table row under /api/v1 has an operation, and each operation a row", () => {
    const rows = documentedRoutes().map(routeKey).sort();
    const ops = OPERATIONS.map(operationKey).sort();
    expect(
      rows.filter((k) => !ops.includes(k)),
      "rows without an operation in src/lib/api-docs/operations.ts",
    ).toEqual([]);
    expect(
      ops.filter((k) => !rows.includes(k)),
      "operations without a route table row",
    ).toEqual([]);
    expect(new Set(ops).size).toBe(ops.length);
  });

  it("each method exported by a file under src/pages/api/v1 is an operation of the document", () => {
    const missing: string[] = [];
    let n = 0;
    for (const f of files(V1)) {
      const file = `v1/${relative(V1, f).split("\\").join("/")}`;
      for (const method of exportedMethods(readFileSync(f, "utf8")).keys()) {
        n++;
        const row = ROUTES.find((r) => r.file === file && r.method === method);
        if (!row || !opAt(method, row.path)) missing.push(`${method} ${file}`);
      }
    }
    expect(missing).toEqual([]);
    expect(n).toBe(documentedRoutes().length);
  });

  it("each operation answers success with its row's status", () => {
    for (const row of documentedRoutes()) {
      const op = opAt(row.method, row.path)!;
      const ok = Object.keys(op.responses).filter((s) => Number(s) < 400);
      expect(ok, routeKey(row)).toEqual([String(row.ok)]);
    }
  });

  it("each operation has an example: its path parameters, its body or file, and its answer", () => {
    for (const o of OPERATIONS) {
      const k = operationKey(o);
      expect(Object.keys(o.example.params ?? {}).sort(), k).toEqual(pathParams(o.path).sort());
      if (o.body?.kind === "json") expect(o.example.body, k).toBeDefined();
      if (o.body?.kind === "multipart") expect(o.example.file?.text.length, k).toBeGreaterThan(0);
      if (o.response.kind === "json") expect(o.example.response, k).toBeDefined();
      else expect(o.example.response, k).toBeUndefined();
    }
  });

  it("anonymous routes need no credentials; session-only routes the session cookie; every other the cookie or an API key of the scope the route table gives", () => {
    for (const row of documentedRoutes()) {
      const op = opAt(row.method, row.path)!;
      const scope = keyScope(row);
      if (row.auth === "anonymous") expect(op.security, routeKey(row)).toEqual([]);
      else {
        expect(op.security, routeKey(row)).toEqual(scope === "session-only" ? [{ sessionCookie: [] }] : [{ sessionCookie: [] }, { bearerAuth: [] }]);
        expect(op["x-paneray-key-scope"], routeKey(row)).toBe(scope);
        expect(Object.keys(op.responses), routeKey(row)).toContain("401");
      }
      if (typeof row.auth === "object") expect(Object.keys(op.responses), routeKey(row)).toContain("404");
      if (typeof row.auth === "object" && row.auth.permission) expect(Object.keys(op.responses), routeKey(row)).toContain("403");
      expect(Object.keys(op.responses)).toContain("503");
      expect(op["x-paneray-access"].length).toBeGreaterThan(10);
    }
  });
});

describe("the statuses of API-key refusals are documented", () => {
  it("a route a narrower key may not call lists 403; a session-only route lists 403; a route open to keys lists 429", () => {
    for (const row of documentedRoutes()) {
      const op = opAt(row.method, row.path)!;
      const statuses = Object.keys(op.responses);
      const scope = keyScope(row);
      if (scope === "session-only" || scope !== "read") expect(statuses, routeKey(row)).toContain("403");
      if (row.auth !== "anonymous" && scope !== "session-only") expect(statuses, routeKey(row)).toContain("429");
      expect(statuses, `${routeKey(row)}: a bad key answers 401 on every route`).toContain("401");
    }
  });
});

describe("the document is OpenAPI 3.1", () => {
  it("has the required top-level members", () => {
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.jsonSchemaDialect).toBe(DIALECT);
    const info = doc.info as { title: string; version: string };
    expect(info.title).toBe("Paneray API");
    expect(info.version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(readFileSync(join(import.meta.dirname, "../../docs/api-changelog.md"), "utf8")).toContain(`## ${info.version}`);
  });

  it("has well-formed paths and operations", () => {
    const ids = new Set<string>();
    const tagNames = TAGS.map((t) => t.name);
    const schemes = Object.keys((doc.components as unknown as { securitySchemes: object }).securitySchemes);
    for (const [path, item] of Object.entries(doc.paths)) {
      expect(path).toMatch(/^\/api\/v1\//);
      const templated = [...path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
      for (const [method, op] of Object.entries(item)) {
        expect(["get", "put", "post", "delete", "patch"]).toContain(method);
        expect(ids.has(op.operationId), op.operationId).toBe(false);
        ids.add(op.operationId);
        expect(op.summary.length).toBeGreaterThan(0);
        expect(op.tags.every((t) => tagNames.includes(t as never))).toBe(true);
        for (const req of op.security) for (const s of Object.keys(req)) expect(schemes).toContain(s);
        const params = (op.parameters ?? []) as { name: string; in: string; required?: boolean; schema: object }[];
        expect(params.filter((p) => p.in === "path").map((p) => p.name)).toEqual(templated);
        for (const p of params) {
          expect(["path", "query"]).toContain(p.in);
          if (p.in === "path") expect(p.required).toBe(true);
          expect(p.schema).toBeTypeOf("object");
        }
        for (const [status, res] of Object.entries(op.responses)) {
          expect(status).toMatch(/^[1-5]\d\d$/);
          expect((res as { description?: string }).description, `${method} ${path} ${status}`).toBeTruthy();
        }
      }
    }
    expect(ids.size).toBe(OPERATIONS.length);
  });

  it("every $ref points at a schema of the document", () => {
    const refs = [...JSON.stringify(doc).matchAll(/"\$ref":"([^"]+)"/g)].map((m) => m[1]!);
    expect(refs.length).toBeGreaterThan(OPERATIONS.length);
    for (const r of new Set(refs)) {
      expect(r).toMatch(/^#\/components\/schemas\/\w+$/);
      expect(doc.components.schemas[r.split("/").pop()!], r).toBeDefined();
    }
  });

  it("every schema in it compiles as JSON Schema draft 2020-12", () => {
    const ajv = newAjv();
    let compiled = 0;
    for (const [name, schema] of Object.entries(doc.components.schemas)) {
      expect(() => ajv.compile(resolvable(schema)), name).not.toThrow();
      compiled++;
    }
    for (const item of Object.values(doc.paths))
      for (const op of Object.values(item)) {
        for (const p of (op.parameters ?? []) as { schema: JsonSchema }[]) {
          ajv.compile(resolvable(p.schema));
          compiled++;
        }
        const content = (op.requestBody as { content?: Record<string, { schema: JsonSchema }> } | undefined)?.content ?? {};
        for (const c of Object.values(content)) {
          ajv.compile(resolvable(c.schema));
          compiled++;
        }
      }
    expect(compiled).toBeGreaterThan(100);
  });
});

describe("the examples fit their schemas", () => {
  const ajv = newAjv();
  for (const o of OPERATIONS) {
    it(operationKey(o), () => {
      if (o.body?.kind === "json") {
        const parsed = o.body.schema.safeParse(o.example.body);
        expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
        const validate = ajv.compile(resolvable(doc.components.schemas[o.body.name]!));
        expect(validate(o.example.body), ajv.errorsText(validate.errors)).toBe(true);
      }
      if (o.query) expect(o.query.schema.safeParse(o.example.query ?? {}).success).toBe(true);
      if (o.response.kind === "json") {
        const parsed = o.response.schema.safeParse(o.example.response);
        expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
        const validate = ajv.compile(resolvable(doc.components.schemas[o.response.name]!));
        expect(validate(o.example.response), ajv.errorsText(validate.errors)).toBe(true);
      }
    });
  }
});

describe("the schemas refuse what the API does not send", () => {
  it("an answer with a missing field or an undocumented one fails", () => {
    const ajv = newAjv();
    const validate = ajv.compile(resolvable(doc.components.schemas.ProjectResponse!));
    const ok = OPERATIONS.find((o) => operationKey(o) === "GET /api/v1/projects/:id")!.example.response as { project: Record<string, unknown> };
    expect(validate(ok)).toBe(true);
    const { name: _name, ...nameless } = ok.project;
    void _name;
    expect(validate({ ...ok, project: nameless })).toBe(false);
    expect(validate({ ...ok, project: { ...ok.project, secret: "x" } })).toBe(false);
  });
});
