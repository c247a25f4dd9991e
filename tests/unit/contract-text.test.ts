// Every string field of every request contract refuses control characters, broken Unicode and (in names)
// bidirectional overrides, naming the field; multi-line descriptions keep tab and line breaks.
import { describe, expect, it } from "vitest";
import type { ZodType } from "zod";
import * as authContracts from "@/lib/contracts/auth";
import * as commonContracts from "@/lib/contracts/common";
import * as glazingContracts from "@/lib/contracts/glazing";
import * as projectContracts from "@/lib/contracts/projects";
import * as scheduleContracts from "@/lib/contracts/schedule";
import * as revisionContracts from "@/lib/contracts/revisions";
import * as deliveryContracts from "@/lib/contracts/deliveries";
import * as apiKeyContracts from "@/lib/contracts/api-keys";
import { fieldPath, zodFieldErrors } from "@/lib/server/http";

const pane = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const measured = { kind: "pane", thicknessMm: 6, measured: { solarTransmittance: 0.6, solarReflectanceFront: 0.2, solarReflectanceBack: 0.2 } };
const gap = { kind: "gap", widthMm: 16, gas: "argon" };
const project = {
  name: "Quay house",
  reference: "Q-7",
  buildingName: "North wing",
  siteName: "Pier 4",
  latitudeDeg: 51.5,
  longitudeDeg: -0.12,
  timeZone: "Europe/London",
  description: "Two lines\nof notes",
  facades: [{ id: "f_1", name: "South", azimuthDeg: 180 }],
};

/** A valid request for each request contract (a new contract must add one here). */
const samples: Record<string, unknown> = {
  SignUpRequest: { name: "Ana Ferro", email: "ana@example.test", password: "long enough", organizationName: "Ferro Studio", invitationId: "inv_1" },
  SignInRequest: { email: "ana@example.test", password: "long enough" },
  InvitationRequest: { email: "ana@example.test", role: "client" },
  MemberRoleRequest: { role: "architect" },
  ApiKeyCreateRequest: { name: "Nightly export", scope: "read" },
  ProjectCreateRequest: { organizationId: "org_1", ...project },
  ProjectUpdateRequest: project,
  ShareRequest: { memberId: "m_1" },
  GlazingRequest: { layers: [pane, gap, measured], polarization: "averaged" },
  ScheduleRequest: {
    site: { latitudeDeg: 38.7, longitudeDeg: -9.1, timeZone: "Europe/Lisbon" },
    surfaces: [{ name: "South", azimuthDeg: 180, tiltDeg: 90, layers: [pane, gap, pane] }],
    from: "2026-06-21",
    to: "2026-06-21",
    sky: { model: "isotropic" },
    weather: [{ time: "2026-06-21T12:30:00Z", ghi: 800, dni: 600, dhi: 100 }],
  },
  RevisionIssueRequest: { note: "For tender\nsecond line", year: 2026 },
  DeliveryRequest: { revision: "A", to: ["design@example.test"], memberIds: ["m_1"], message: "Revision A\nfor review" },
};

const modules = {
  ...authContracts,
  ...glazingContracts,
  ...projectContracts,
  ...scheduleContracts,
  ...revisionContracts,
  ...deliveryContracts,
  ...apiKeyContracts,
  ...commonContracts,
};
const isSchema = (v: unknown): v is ZodType => typeof v === "object" && v !== null && "safeParse" in v && "_zod" in v;
const requestSchemas = Object.entries(modules).filter(([k, v]) => k.endsWith("Request") && isSchema(v)) as [string, ZodType][];

/** Paths of every string value in a sample, with the path as the API names it. */
function stringLeaves(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (typeof value === "string") return [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => stringLeaves(v, [...path, i]));
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => stringLeaves(v, [...path, k]));
  return [];
}

function withValue(value: unknown, path: (string | number)[], leaf: string): unknown {
  if (!path.length) return leaf;
  const [head, ...rest] = path;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<string | number, unknown>;
  copy[head!] = withValue((value as Record<string | number, unknown>)[head!], rest, leaf);
  return copy;
}

const refusedEverywhere = {
  NUL: "a\u0000b",
  "a lone NUL": "\u0000",
  BEL: "ring\u0007",
  "carriage return": "one\rtwo",
  DEL: "del\u007f",
  "C1 control NEL": "next\u0085line",
  "C1 control CSI": "csi\u009b",
  "unpaired high surrogate": "x\ud800y",
  "unpaired low surrogate": "\udc00",
};
const refusedInNames = {
  ...refusedEverywhere,
  "line feed": "one\ntwo",
  tab: "a\tb",
  "right-to-left override": "exe\u202egpj",
  "first strong isolate": "a\u2068b",
};

describe("contract string fields", () => {
  it("every request contract has a valid sample", () => {
    expect(requestSchemas.map(([k]) => k).sort()).toEqual(Object.keys(samples).sort());
    for (const [key, schema] of requestSchemas) expect(schema.safeParse(samples[key]).error?.issues ?? [], key).toEqual([]);
  });

  const cases = requestSchemas.flatMap(([key, schema]) => stringLeaves(samples[key]).map((path) => ({ key, schema, path, field: fieldPath(path) })));

  it("finds the string fields", () => {
    const fields = new Set(cases.map((c) => `${c.key}.${c.field}`));
    for (const f of [
      "SignUpRequest.organizationName",
      "ProjectCreateRequest.facades[0].name",
      "ScheduleRequest.surfaces[0].name",
      "ScheduleRequest.weather[0].time",
    ])
      expect(fields).toContain(f);
  });

  it.each(cases.map((c) => [`${c.key}.${c.field}`, c] as const))("%s refuses control characters and broken Unicode, naming the field", (_, c) => {
    const multiline = c.field === "description" || c.field === "note" || c.field === "message";
    for (const [what, bad] of Object.entries(multiline ? refusedEverywhere : refusedInNames)) {
      const r = c.schema.safeParse(withValue(samples[c.key], c.path, bad));
      expect(r.success, `${c.key}.${c.field} accepted ${what}`).toBe(false);
      expect(
        zodFieldErrors(r.error!).map((e) => e.field),
        `${c.key}.${c.field} with ${what}`,
      ).toContain(c.field);
    }
  });

  it("names say which rule they break, in words", () => {
    const r = projectContracts.ProjectCreateRequest.safeParse({ ...samples.ProjectCreateRequest!, name: "Tower\u0000" } as object);
    expect(zodFieldErrors(r.error!)).toContainEqual({ field: "name", message: "name must not contain control characters" });
    const b = projectContracts.ProjectCreateRequest.safeParse({ ...samples.ProjectCreateRequest!, siteName: "Plot \u202e9" } as object);
    expect(zodFieldErrors(b.error!)).toContainEqual({ field: "siteName", message: "siteName must not contain bidirectional override characters" });
  });

  it("a description keeps tabs and line breaks (CR LF read as LF) and right-to-left text", () => {
    const r = projectContracts.ProjectUpdateRequest.parse({ description: "a\tb\r\nc\nd \u2067שלום\u2069" });
    expect(r.description).toBe("a\tb\nc\nd \u2067שלום\u2069");
  });

  it("ordinary text outside ASCII stays accepted", () => {
    const r = projectContracts.ProjectUpdateRequest.parse({ name: "Façade Øst — 東棟 🏢", siteName: "Praça d’Ouro" });
    expect(r).toEqual({ name: "Façade Øst — 東棟 🏢", siteName: "Praça d’Ouro" });
  });
});
