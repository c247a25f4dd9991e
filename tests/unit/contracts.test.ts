import { describe, expect, it } from "vitest";
import { ProjectCreateRequest, ProjectUpdateRequest } from "@/lib/contracts/projects";
import { InvitationRequest, SignUpRequest } from "@/lib/contracts/auth";
import { isIanaTimeZone } from "@/lib/contracts/common";
import { zodFieldErrors } from "@/lib/server/http";

const valid = {
  organizationId: "org_1",
  name: "Test building",
  siteName: "Plot 1",
  latitudeDeg: 51.5,
  longitudeDeg: -0.12,
  timeZone: "Europe/London",
};

const fields = (r: { success: boolean; error?: unknown }) => (r.success ? [] : zodFieldErrors(r.error as never).map((e) => e.field));

describe("project contract", () => {
  it("accepts a minimal project and fills defaults", () => {
    const r = ProjectCreateRequest.parse(valid);
    expect(r.elevationM).toBe(0);
    expect(r.facades).toEqual([]);
    expect(r.reference).toBeNull();
  });

  it.each([
    ["latitudeDeg", 90.01],
    ["latitudeDeg", -91],
    ["latitudeDeg", Number.NaN],
    ["longitudeDeg", 180.5],
    ["longitudeDeg", "12"],
    ["latitudeDeg", Number.POSITIVE_INFINITY],
    ["elevationM", 1e9],
    ["timeZone", "Mars/Olympus"],
    ["timeZone", "CEST"],
    ["name", "   "],
    ["name", "x".repeat(201)],
  ])("refuses %s = %s and names the field", (field, value) => {
    expect(fields(ProjectCreateRequest.safeParse({ ...valid, [field]: value }))).toContain(field);
  });

  it("names the façade field by index", () => {
    const r = ProjectCreateRequest.safeParse({
      ...valid,
      facades: [
        { name: "N", azimuthDeg: 0 },
        { name: "S", azimuthDeg: 400 },
      ],
    });
    expect(fields(r)).toEqual(["facades[1].azimuthDeg"]);
  });

  it("normalises an azimuth of 360° to 0° and defaults tilt to vertical", () => {
    const r = ProjectCreateRequest.parse({ ...valid, facades: [{ name: "N", azimuthDeg: 360 }] });
    expect(r.facades[0]).toEqual({ name: "N", azimuthDeg: 0, tiltDeg: 90 });
  });

  it("an update with no field is refused; a partial update does not invent defaults", () => {
    expect(ProjectUpdateRequest.safeParse({}).success).toBe(false);
    expect(ProjectUpdateRequest.parse({ name: "New" })).toEqual({ name: "New" });
  });
});

describe("account contracts", () => {
  it("normalises e-mail addresses", () => {
    expect(InvitationRequest.parse({ email: "  Ana@Example.COM ", role: "client" }).email).toBe("ana@example.com");
  });
  it("refuses roles outside the four", () => {
    expect(fields(InvitationRequest.safeParse({ email: "a@b.example", role: "admin" }))).toEqual(["role"]);
  });
  it("needs a firm name unless the sign-up accepts an invitation", () => {
    const base = { name: "A", email: "a@b.example", password: "long enough" };
    expect(fields(SignUpRequest.safeParse(base))).toEqual(["organizationName"]);
    expect(SignUpRequest.safeParse({ ...base, invitationId: "abc123" }).success).toBe(true);
    expect(fields(SignUpRequest.safeParse({ ...base, organizationName: "F", password: "short" }))).toEqual(["password"]);
  });
});

describe("time zones", () => {
  it("accepts IANA names and refuses abbreviations", () => {
    expect(isIanaTimeZone("Europe/Lisbon")).toBe(true);
    expect(isIanaTimeZone("America/Argentina/Buenos_Aires")).toBe(true);
    expect(isIanaTimeZone("UTC")).toBe(true);
    expect(isIanaTimeZone("PST")).toBe(false);
    expect(isIanaTimeZone("Nowhere/Land")).toBe(false);
  });
});
