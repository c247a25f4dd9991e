import { describe, expect, it } from "vitest";
import { z } from "zod";
import { withProblems, HttpError, readJson } from "@/lib/server/http";

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
    const streamed = new Request("http://127.0.0.1/x", { method: "POST", body: stream, headers: { "content-type": "application/json" }, duplex: "half" } as RequestInit);
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
