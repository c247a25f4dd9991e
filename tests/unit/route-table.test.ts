// The route table (src/lib/auth/route-table.ts) against the route files: every file under src/pages/api and
// every method it exports has exactly one row, and each row's rule is the one the endpoint declares.
import { readFileSync } from "node:fs";
import { relative } from "node:path";
import { describe, expect, it } from "vitest";
import { keyScope, routeOfPattern, ROUTES, routeKey, scopeAllows, type RouteEntry } from "@/lib/auth/route-table";

import { API_DIR, exportedMethods, routeFiles } from "./fixtures/route-files";

const files = routeFiles(API_DIR).map((f) => ({ file: relative(API_DIR, f).split("\\").join("/"), source: readFileSync(f, "utf8") }));
const found = files.flatMap(({ file, source }) => [...exportedMethods(source)].map(([method, code]) => ({ file, method, code })));
const rowOf = (file: string, method: string) => ROUTES.filter((r) => r.file === file && r.method === method);

describe("route table", () => {
  it("finds the route files", () => {
    expect(files.length).toBeGreaterThan(10);
  });

  it("has one row for every (file, method) under src/pages/api", () => {
    const missing = found.filter((f) => rowOf(f.file, f.method).length !== 1).map((f) => `${f.method} ${f.file}`);
    expect(missing, "routes without exactly one row in src/lib/auth/route-table.ts").toEqual([]);
  });

  it("has no row for a route that does not exist", () => {
    const stale = ROUTES.filter((r) => !found.some((f) => f.file === r.file && f.method === r.method)).map(routeKey);
    expect(stale).toEqual([]);
  });

  it("gives each row the path its file serves", () => {
    for (const r of ROUTES) {
      const fromFile =
        "/api/" +
        r.file
          .replace(/\.(ts|js|mjs)$/, "")
          .replace(/(^|\/)index$/, "")
          .replace(/\[\.\.\.(\w+)\]/g, ":path*")
          .replace(/\[(\w+)\]/g, ":$1");
      expect(r.path, r.file).toBe(fromFile.replace(/\/$/, ""));
    }
  });

  it("states the rule each endpoint declares", () => {
    const declared = (r: RouteEntry) => found.find((f) => f.file === r.file && f.method === r.method)!.code;
    for (const r of ROUTES) {
      const code = declared(r);
      const key = routeKey(r);
      if (r.auth === "better-auth") expect(code, key).toMatch(/handleAuthRequest\(/);
      else if (r.file === "health.ts") expect(code, key).not.toMatch(/endpoint\(/);
      else if (r.auth === "anonymous" || r.auth === "user") expect(code, key).toMatch(new RegExp(`auth:\\s*"${r.auth}"`));
      else {
        const a = r.auth;
        const [name, value] =
          "project" in a
            ? ["project", a.project]
            : "option" in a
              ? ["option", a.option]
              : "delivery" in a
                ? ["delivery", a.delivery]
                : "makeup" in a
                  ? ["makeup", a.makeup]
                  : "pane" in a
                    ? ["pane", a.pane]
                    : ["org", a.org];
        expect(code, key).toMatch(new RegExp(`auth:\\s*\\{\\s*${name}:\\s*"${value}"`));
        if (a.permission) expect(code, key).toMatch(new RegExp(`permission:\\s*"${a.permission}"`));
        else expect(code, key).not.toMatch(/permission:/);
        if ("org" in a && a.from === "body") expect(code, key).toMatch(/from:\s*"body"/);
      }
    }
  });

  it("notices a route file with a method the table does not list", () => {
    expect([...exportedMethods('export const GET = endpoint({ auth: "user" }, h);\nexport const PUT = x;').keys()]).toEqual(["GET", "PUT"]);
  });
});

describe("API-key scope rule", () => {
  const scopeOf = (method: string, path: string) => keyScope(ROUTES.find((r) => r.method === method && r.path === path)!);

  it("needs a session for key management, members, invitations, sign-up, acceptance and better-auth", () => {
    const sessionOnly = ROUTES.filter((r) => keyScope(r) === "session-only")
      .map(routeKey)
      .sort();
    expect(sessionOnly).toEqual(
      [
        "ALL /api/auth/:path*",
        "POST /api/v1/signup",
        "POST /api/v1/invitations/:id/accept",
        "GET /api/v1/orgs/:orgId/members",
        "PATCH /api/v1/orgs/:orgId/members/:memberId",
        "DELETE /api/v1/orgs/:orgId/members/:memberId",
        "GET /api/v1/orgs/:orgId/invitations",
        "POST /api/v1/orgs/:orgId/invitations",
        "DELETE /api/v1/orgs/:orgId/invitations/:invitationId",
        "GET /api/v1/orgs/:orgId/api-keys",
        "POST /api/v1/orgs/:orgId/api-keys",
        "DELETE /api/v1/orgs/:orgId/api-keys/:id",
      ].sort(),
    );
  });

  it("gives GET routes to read keys, the calculations to calculate keys and the other writes to read-write keys", () => {
    expect(scopeOf("GET", "/api/v1/projects/:id/workbook")).toBe("read");
    expect(scopeOf("POST", "/api/v1/calc/glazing")).toBe("calculate");
    expect(scopeOf("POST", "/api/v1/calc/schedule")).toBe("calculate");
    expect(scopeOf("PATCH", "/api/v1/projects/:id")).toBe("read-write");
    expect(scopeOf("POST", "/api/v1/projects/:id/weather")).toBe("read-write");
    for (const r of ROUTES) if (keyScope(r) === "read") expect(r.method, routeKey(r)).toBe("GET");
  });

  it("orders the scopes: each includes the narrower ones, none reaches a session-only route", () => {
    expect([scopeAllows("read", "read"), scopeAllows("read", "calculate"), scopeAllows("read", "read-write")]).toEqual([true, false, false]);
    expect([scopeAllows("calculate", "read"), scopeAllows("calculate", "calculate"), scopeAllows("calculate", "read-write")]).toEqual([
      true,
      true,
      false,
    ]);
    expect([scopeAllows("read-write", "read"), scopeAllows("read-write", "calculate"), scopeAllows("read-write", "read-write")]).toEqual([
      true,
      true,
      true,
    ]);
    for (const s of ["read", "calculate", "read-write"] as const) expect(scopeAllows(s, "session-only")).toBe(false);
  });

  it("finds the row of every route from the pattern Astro reports (in lower case)", () => {
    for (const r of ROUTES) {
      const pattern =
        "/api/" +
        r.file
          .replace(/\.(ts|js|mjs)$/, "")
          .replace(/(^|\/)index$/, "")
          .replace(/\/$/, "");
      const method = r.method === "ALL" ? "POST" : r.method;
      expect(routeOfPattern(method, pattern), routeKey(r)).toBe(r);
      expect(routeOfPattern(method, pattern.toLowerCase()), routeKey(r)).toBe(r);
    }
    expect(routeOfPattern("PUT", "/api/v1/projects/[id]")).toBeUndefined();
  });
});
