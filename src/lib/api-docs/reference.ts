/**
 * The reference page's view of the API document: operations grouped by tag, each with its parameters, its
 * request and response fields as rows (nested fields indented by depth), its error statuses and copy-able
 * curl and TypeScript `fetch` examples built from the operation's example. Pure (no I/O).
 */
import type { JsonSchema, OpenApiOperation } from "./openapi";

export interface FieldRow {
  name: string;
  type: string;
  constraints: string;
  required: boolean;
  description: string;
  depth: number;
}

export interface ReferenceOperation {
  id: string;
  method: string;
  path: string;
  summary: string;
  description: string;
  access: string;
  keyScope: string | null;
  params: FieldRow[];
  requestKind: "json" | "multipart" | null;
  requestNote: string;
  request: FieldRow[];
  successStatus: string;
  successNote: string;
  response: FieldRow[];
  responseType: string | null;
  errors: { status: string; description: string }[];
  curl: string;
  fetch: string;
}

type Doc = {
  info: { version: string };
  tags: { name: string; description: string }[];
  paths: Record<string, Record<string, OpenApiOperation>>;
  components: { schemas: Record<string, JsonSchema> };
};

const MAX_DEPTH = 4;

function resolve(s: JsonSchema, doc: Doc): JsonSchema {
  const ref = s.$ref as string | undefined;
  return ref ? resolve(doc.components.schemas[ref.split("/").pop()!] ?? {}, doc) : s;
}

function typeOf(s: JsonSchema, doc: Doc): string {
  const r = resolve(s, doc);
  if (r.const !== undefined) return JSON.stringify(r.const);
  if (Array.isArray(r.enum)) return r.enum.map((v) => JSON.stringify(v)).join(" | ");
  const alts = (r.anyOf ?? r.oneOf) as JsonSchema[] | undefined;
  if (alts) return [...new Set(alts.map((a) => typeOf(a, doc)))].join(" | ");
  if (r.type === "array") return `${typeOf((r.items as JsonSchema) ?? {}, doc)}[]`;
  if (Array.isArray(r.type)) return r.type.join(" | ");
  if (typeof r.type === "string") return r.type === "integer" ? "integer" : r.type;
  return "any";
}

function constraintsOf(s: JsonSchema): string {
  const out: string[] = [];
  const n = (k: string) => (typeof s[k] === "number" ? (s[k] as number) : undefined);
  if (n("minimum") !== undefined) out.push(`≥ ${n("minimum")}`);
  if (n("exclusiveMinimum") !== undefined) out.push(`> ${n("exclusiveMinimum")}`);
  if (n("maximum") !== undefined) out.push(`≤ ${n("maximum")}`);
  if (n("exclusiveMaximum") !== undefined) out.push(`< ${n("exclusiveMaximum")}`);
  if (n("minLength") !== undefined) out.push(`length ≥ ${n("minLength")}`);
  if (n("maxLength") !== undefined) out.push(`length ≤ ${n("maxLength")}`);
  if (n("minItems") !== undefined) out.push(`items ≥ ${n("minItems")}`);
  if (n("maxItems") !== undefined) out.push(`items ≤ ${n("maxItems")}`);
  if (s.format) out.push(String(s.format));
  else if (typeof s.pattern === "string" && s.pattern.length <= 40) out.push(`matches ${s.pattern}`);
  if (s.default !== undefined) out.push(`default ${JSON.stringify(s.default)}`);
  return out.join(", ");
}

/**
 * The fields of an object schema as rows; nested objects (and arrays of objects) follow their parent one level
 * deeper, and each form of a union of objects gets a heading row ("one of: …") with its fields below it.
 */
export function fieldRows(schema: JsonSchema, doc: Doc, depth = 0, prefix = ""): FieldRow[] {
  const s = resolve(schema, doc);
  const alts = ((s.anyOf ?? s.oneOf) as JsonSchema[] | undefined)?.map((a) => resolve(a, doc)).filter((a) => a.type === "object" && a.properties);
  if (alts?.length === 1) return fieldRows(alts[0]!, doc, depth, prefix);
  if (alts?.length) return alts.flatMap((a, i) => [altRow(a, i, depth), ...fieldRows(a, doc, depth + 1, prefix)]);
  const props = (s.properties ?? {}) as Record<string, JsonSchema>;
  const required = new Set((s.required as string[] | undefined) ?? []);
  const rows: FieldRow[] = [];
  for (const [key, raw] of Object.entries(props)) {
    const p = resolve(raw, doc);
    const name = prefix ? `${prefix}.${key}` : key;
    rows.push({
      name,
      type: typeOf(p, doc),
      constraints: constraintsOf(p),
      required: required.has(key),
      description: String(p.description ?? raw.description ?? ""),
      depth,
    });
    if (depth >= MAX_DEPTH) continue;
    const inner = p.type === "array" ? resolve((p.items as JsonSchema) ?? {}, doc) : p;
    const hasObject = inner.properties || ((inner.anyOf ?? inner.oneOf) as JsonSchema[] | undefined)?.some((a) => resolve(a, doc).properties);
    if (hasObject) rows.push(...fieldRows(inner, doc, depth + 1, p.type === "array" ? `${name}[]` : name));
  }
  return rows;
}
const altRow = (a: JsonSchema, i: number, depth: number): FieldRow => {
  const kind = ((a.properties as Record<string, JsonSchema>).kind?.const as string | undefined) ?? null;
  const keys = ((a.required as string[] | undefined) ?? []).filter((k) => k !== "kind");
  return {
    name: `one of: form ${i + 1}`,
    type: kind ? `kind "${kind}"` : "object",
    constraints: "",
    required: false,
    description: keys.length ? `With ${keys.join(", ")}` : "",
    depth,
  };
};

/** Whether an organisation API key may call the operation (session-only operations need the session cookie). */
const takesKey = (op: OpenApiOperation) => op.security.some((s) => "bearerAuth" in s);
/** Session-only operations: a signed-in browser session, never a key. */
const sessionOnly = (op: OpenApiOperation) => op.security.length > 0 && !takesKey(op);

const shellQuote = (s: string) => `'${s.replace(/'/g, `'\\''`)}'`;

/** The URL of an example with its parameters and query. */
export function exampleUrl(path: string, ex: OpenApiOperation["x-paneray-example"]): string {
  const p = path.replace(/\{(\w+)\}/g, (_, n: string) => encodeURIComponent(ex.params?.[n] ?? n));
  const q = Object.entries(ex.query ?? {});
  return q.length ? `${p}?${new URLSearchParams(q).toString().replace(/%2C/g, ",")}` : p;
}

export function curlOf(base: string, method: string, path: string, op: OpenApiOperation, fileOut: string | null): string {
  const ex = op["x-paneray-example"];
  const lines = [`curl${method === "GET" ? "" : ` -X ${method}`} "${base}${exampleUrl(path, ex)}"`];
  if (takesKey(op)) lines.push(`  -H "Authorization: Bearer $PANERAY_KEY"`);
  if (sessionOnly(op)) lines.push(`  -H "Origin: ${base}" -b "$PANERAY_SESSION_COOKIES"`);
  if (ex.body !== undefined) lines.push(`  -H "Content-Type: application/json"`, `  -d ${shellQuote(JSON.stringify(ex.body, null, 2))}`);
  if (ex.file) lines.push(`  -F "file=@${ex.file.name};type=${ex.file.contentType}"`);
  if (fileOut) lines.push(`  -o ${shellQuote(fileOut)}`);
  return lines.join(" \\\n");
}

export function fetchOf(base: string, method: string, path: string, op: OpenApiOperation, kind: "json" | "file" | "empty"): string {
  const ex = op["x-paneray-example"];
  const headers: string[] = [];
  if (takesKey(op)) headers.push("Authorization: `Bearer ${process.env.PANERAY_KEY}`");
  if (ex.body !== undefined) headers.push(`"Content-Type": "application/json"`);
  const init: string[] = [];
  if (method !== "GET") init.push(`method: "${method}"`);
  if (headers.length) init.push(`headers: { ${headers.join(", ")} }`);
  const pre: string[] = [];
  if (ex.body !== undefined) init.push(`body: JSON.stringify(${JSON.stringify(ex.body, null, 2).replace(/\n/g, "\n  ")})`);
  if (ex.file) {
    pre.push(
      `const form = new FormData();`,
      `form.append("file", new Blob([await readFile("${ex.file.name}")], { type: "${ex.file.contentType}" }), "${ex.file.name}");`,
    );
    init.push("body: form");
  }
  const call = `const res = await fetch("${base}${exampleUrl(path, ex)}"${init.length ? `, {\n  ${init.join(",\n  ")},\n}` : ""});`;
  const after =
    kind === "json"
      ? [`if (!res.ok) throw new Error((await res.json()).detail); // problem+json`, `const data = await res.json();`]
      : kind === "file"
        ? [`if (!res.ok) throw new Error((await res.json()).detail);`, `const bytes = new Uint8Array(await res.arrayBuffer());`]
        : [`if (res.status !== 204) throw new Error((await res.json()).detail);`];
  const note = sessionOnly(op)
    ? ["// A signed-in session only (API keys cannot call this): run it in a page of this server, whose cookie the browser sends.", ""]
    : [];
  return [...note, ...(ex.file ? [`import { readFile } from "node:fs/promises";`, ""] : []), ...pre, call, ...after].join("\n");
}

/** The operations of the document by tag, in the tags' order. */
export function referenceOf(doc: Doc, base: string): { tag: string; description: string; operations: ReferenceOperation[] }[] {
  const all: (ReferenceOperation & { tag: string })[] = [];
  for (const [path, item] of Object.entries(doc.paths)) {
    for (const [m, op] of Object.entries(item)) {
      const method = m.toUpperCase();
      const [successStatus, success] = Object.entries(op.responses).find(([s]) => Number(s) < 400) as [
        string,
        { description: string; content?: Record<string, { schema: JsonSchema }> },
      ];
      const responseType = success.content ? Object.keys(success.content)[0]! : null;
      const kind = !responseType ? "empty" : responseType === "application/json" ? "json" : "file";
      const reqContent = (op.requestBody as { description?: string; content: Record<string, { schema: JsonSchema }> } | undefined) ?? null;
      const requestKind = reqContent ? (reqContent.content["application/json"] ? "json" : "multipart") : null;
      const params = ((op.parameters ?? []) as { name: string; in: string; required: boolean; description: string; schema: JsonSchema }[]).map(
        (p) => ({
          name: p.name,
          type: `${typeOf(p.schema, doc)} (${p.in})`,
          constraints: constraintsOf(p.schema),
          required: p.required,
          description: p.description,
          depth: 0,
        }),
      );
      const fileOut = kind === "file" ? (responseType!.includes("spreadsheetml") ? "schedule.xlsx" : "table.csv") : null;
      all.push({
        tag: op.tags[0]!,
        id: op.operationId,
        method,
        path,
        summary: op.summary,
        description: op.description,
        access: op["x-paneray-access"],
        keyScope: op["x-paneray-key-scope"] ?? null,
        params,
        requestKind,
        requestNote: reqContent?.description ?? "",
        request: reqContent ? fieldRows(Object.values(reqContent.content)[0]!.schema, doc) : [],
        successStatus,
        successNote: success.description,
        response: kind === "json" ? fieldRows(success.content!["application/json"]!.schema, doc) : [],
        responseType,
        errors: Object.entries(op.responses)
          .filter(([s]) => Number(s) >= 400)
          .map(([status, r]) => ({ status, description: (r as { description: string }).description })),
        curl: curlOf(base, method, path, op, fileOut),
        fetch: fetchOf(base, method, path, op, kind),
      });
    }
  }
  return doc.tags
    .map((t) => ({ tag: t.name, description: t.description, operations: all.filter((o) => o.tag === t.name) }))
    .filter((g) => g.operations.length > 0);
}
