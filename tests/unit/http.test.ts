import { beforeEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { endpoint, json, MAX_JSON_BYTES, withProblems, HttpError, readJson } from "@/lib/server/http";
import { ConflictError, ForbiddenError, InvalidError, NotFoundError } from "@/lib/server/errors";

// The access rules need a database; the factory's auth modes are tested against stand-ins.
const access = vi.hoisted(() => ({ requireProject: vi.fn(), requireOrgPermission: vi.fn() }));
vi.mock("@/lib/server/services/access", () => access);

const Schema = z.object({ a: z.number(), b: z.object({ c: z.string() }) });
const req = (body: BodyInit | null, headers: Record<string, string> = { "content-type": "application/json" }) =>
  new Request("http://127.0.0.1/x", { method: "POST", body, headers });

async function statusOf(p: Promise<unknown>): Promise<number | "ok"> {
  try {
    await p;
    return "ok";
  } catch (e) {
    return e instanceof HttpError ? e.status : -1;
  }
}

describe("readJson", () => {
  it("parses a valid body", async () => {
    await expect(readJson(req(JSON.stringify({ a: 1, b: { c: "x" } })), Schema)).resolves.toEqual({ a: 1, b: { c: "x" } });
  });
  it("answers 400 for malformed JSON and for an empty body", async () => {
    expect(await statusOf(readJson(req("{oops"), Schema))).toBe(400);
    expect(await statusOf(readJson(req(""), Schema))).toBe(400);
  });
  it("names the nested field that failed", async () => {
    try {
      await readJson(req(JSON.stringify({ a: 1, b: { c: 5 } })), Schema);
      expect.unreachable();
    } catch (e) {
      expect((e as HttpError).status).toBe(400);
      expect((e as HttpError).message).toContain('"b.c"');
      expect((e as HttpError).extra.errors?.[0]?.field).toBe("b.c");
    }
  });
  it("answers 413 past the size limit, whether declared or streamed", async () => {
    const big = JSON.stringify({ a: 1, b: { c: "x".repeat(5000) } });
    expect(await statusOf(readJson(req(big), Schema, 1000))).toBe(413);
    const stream = new ReadableStream({
      start(c) {
        c.enqueue(new TextEncoder().encode(big));
        c.close();
      },
    });
    const streamed = new Request("http://127.0.0.1/x", {
      method: "POST",
      body: stream,
      headers: { "content-type": "application/json" },
      duplex: "half",
    } as RequestInit);
    expect(await statusOf(readJson(streamed, Schema, 1000))).toBe(413);
  });
  it("answers 415 for a form body", async () => {
    expect(await statusOf(readJson(req("a=1", { "content-type": "application/x-www-form-urlencoded" }), Schema))).toBe(415);
  });
});

describe("endpoint wrapper", () => {
  const ctx = { request: new Request("http://127.0.0.1/x"), url: new URL("http://127.0.0.1/x") } as never;
  it("turns HttpError into problem+json", async () => {
    const res = await withProblems(() => {
      throw new HttpError(403, "no");
    })(ctx);
    expect(res.status).toBe(403);
    expect(res.headers.get("content-type")).toContain("application/problem+json");
    expect(await res.json()).toMatchObject({ status: 403, detail: "no" });
  });
  it("hides unexpected errors behind a 500 without details", async () => {
    const err = console.error;
    console.error = () => {};
    const res = await withProblems(() => {
      throw new Error("secret internals");
    })(ctx);
    console.error = err;
    expect(res.status).toBe(500);
    expect(JSON.stringify(await res.json())).not.toContain("secret");
  });
});

describe("endpoint factory", () => {
  type Locals = { user: { id: string; email: string; name: string } | null };
  const signedIn: Locals = { user: { id: "u1", email: "u1@test.example", name: "U One" } };
  const call = (
    route: ReturnType<typeof endpoint>,
    opts: { locals?: Locals; params?: Record<string, string>; body?: unknown; raw?: string } = {},
  ) => {
    const text = opts.raw ?? (opts.body === undefined ? undefined : JSON.stringify(opts.body));
    const request = new Request("http://127.0.0.1/api/x", {
      method: text === undefined ? "GET" : "POST",
      body: text,
      headers: text === undefined ? {} : { "content-type": "application/json" },
    });
    return route({ request, url: new URL(request.url), params: opts.params ?? {}, locals: opts.locals ?? { user: null } } as never);
  };
  const quiet = async <T>(fn: () => T | Promise<T>) => {
    const err = console.error;
    console.error = () => {};
    try {
      return await fn();
    } finally {
      console.error = err;
    }
  };

  beforeEach(() => {
    access.requireProject.mockReset();
    access.requireOrgPermission.mockReset();
  });

  it("anonymous endpoints run without a user; the others answer 401 before reading anything", async () => {
    const open = endpoint({ auth: "anonymous" }, ({ user }) => json({ user }));
    expect(await (await call(open)).json()).toEqual({ user: null });
    const closed = endpoint({ auth: "user", body: Schema }, () => json({ ran: true }));
    const res = await call(closed, { raw: "{not json" });
    expect(res.status).toBe(401);
    expect(res.headers.get("content-type")).toContain("application/problem+json");
    expect((await call(closed, { locals: signedIn, body: { a: 1, b: { c: "x" } } })).status).toBe(200);
  });

  it("answers 404 for route parameters that fail their schema, 400 naming the field for bodies", async () => {
    const route = endpoint(
      { auth: "user", params: z.object({ id: z.string().regex(/^[a-z]+$/, "not a valid id") }), body: Schema },
      ({ params, body }) => json({ id: params.id, c: body.b.c }),
    );
    expect((await call(route, { locals: signedIn, params: { id: "<x>" }, body: { a: 1, b: { c: "x" } } })).status).toBe(404);
    const bad = await call(route, { locals: signedIn, params: { id: "abc" }, body: { a: 1, b: { c: 2 } } });
    expect(bad.status).toBe(400);
    expect((await bad.json()).errors).toEqual([{ field: "b.c", message: expect.any(String) }]);
    expect(await (await call(route, { locals: signedIn, params: { id: "abc" }, body: { a: 1, b: { c: "y" } } })).json()).toEqual({
      id: "abc",
      c: "y",
    });
  });

  it("holds each endpoint to its own body limit", async () => {
    const body = { a: 1, b: { c: "x".repeat(2000) } };
    const small = endpoint({ auth: "user", body: Schema, maxBytes: 1000 }, () => json({}));
    const large = endpoint({ auth: "user", body: Schema, maxBytes: 4000 }, () => json({}));
    expect((await call(small, { locals: signedIn, body })).status).toBe(413);
    expect((await call(large, { locals: signedIn, body })).status).toBe(200);
    const byDefault = endpoint({ auth: "user", body: Schema }, () => json({}));
    expect((await call(byDefault, { locals: signedIn, body: { a: 1, b: { c: "x".repeat(MAX_JSON_BYTES) } } })).status).toBe(413);
  });

  it("loads the project named by the parameter with the permission, and hands it to the handler", async () => {
    access.requireProject.mockResolvedValue({ project: { id: "p1", name: "Tower" }, membership: { role: "consultant" } });
    const route = endpoint(
      { auth: { project: "id", permission: "project:update" }, params: z.object({ id: z.string() }) },
      ({ project, membership }) => json({ name: project.name, role: membership.role }),
    );
    expect(await (await call(route, { locals: signedIn, params: { id: "p1" } })).json()).toEqual({ name: "Tower", role: "consultant" });
    expect(access.requireProject).toHaveBeenCalledWith("u1", "p1", { project: ["update"] }, "edit projects");
  });

  it("checks an organisation permission named in the body after the body is valid", async () => {
    access.requireOrgPermission.mockRejectedValue(ForbiddenError.forRole("client", "create projects"));
    const route = endpoint(
      { auth: { org: "organizationId", from: "body", permission: "project:create" }, body: z.object({ organizationId: z.string() }) },
      () => json({ ran: true }),
    );
    expect((await call(route, { locals: signedIn, body: {} })).status).toBe(400);
    expect(access.requireOrgPermission).not.toHaveBeenCalled();
    const res = await call(route, { locals: signedIn, body: { organizationId: "o1" } });
    expect(res.status).toBe(403);
    expect((await res.json()).detail).toBe("Your role (client) does not allow you to create projects");
    expect(access.requireOrgPermission).toHaveBeenCalledWith("u1", "o1", { project: ["create"] }, "create projects");
  });

  it("maps domain errors to 404, 403, 409 and 400 with errors[].field", async () => {
    const failing = (err: Error) => endpoint({ auth: "user" }, () => Promise.reject(err));
    const notFound = await call(failing(new NotFoundError("No such project, or it is not shared with you")), { locals: signedIn });
    expect(notFound.status).toBe(404);
    expect(await notFound.json()).toMatchObject({ status: 404, title: "Not found", detail: "No such project, or it is not shared with you" });
    expect((await call(failing(ForbiddenError.forRole("architect", "edit projects")), { locals: signedIn })).status).toBe(403);
    const conflict = await call(failing(new ConflictError("already a member", [{ field: "email", message: "already a member" }])), {
      locals: signedIn,
    });
    expect(conflict.status).toBe(409);
    expect((await conflict.json()).errors).toEqual([{ field: "email", message: "already a member" }]);
    const invalid = await call(failing(new InvalidError("facades", "unknown façade id", 'Façade id "f9" does not belong to this project')), {
      locals: signedIn,
    });
    expect(invalid.status).toBe(400);
    expect(await invalid.json()).toMatchObject({
      detail: 'Façade id "f9" does not belong to this project',
      errors: [{ field: "facades", message: "unknown façade id" }],
    });
  });

  it("maps the engine's RangeError to 400 naming the declared field, and only where declared", async () => {
    const engine = () => {
      throw new RangeError("no pane can transmit 0.9 and reflect 0.2");
    };
    const declared = endpoint({ auth: "user", engineErrorsField: "layers" }, engine);
    const res = await call(declared, { locals: signedIn });
    expect(res.status).toBe(400);
    expect(await res.json()).toMatchObject({
      detail: "no pane can transmit 0.9 and reflect 0.2",
      errors: [{ field: "layers", message: "no pane can transmit 0.9 and reflect 0.2" }],
    });
    const undeclared = endpoint({ auth: "user" }, engine);
    const failed = await quiet(() => call(undeclared, { locals: signedIn }));
    expect(failed.status).toBe(500);
    expect(JSON.stringify(await failed.json())).not.toContain("transmit");
  });
});
