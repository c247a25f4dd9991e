// The project contract's site and façade fields: sky settings, monthly turbidity, glazed area, the typical
// window and its shading devices; empty form fields are "not given", refusals name the field in words.
import { describe, expect, it } from "vitest";
import { ProjectCreateRequest, ProjectUpdateRequest } from "@/lib/contracts/projects";

const base = { organizationId: "org-1", name: "Block", siteName: "Plot", latitudeDeg: 50, longitudeDeg: 5, timeZone: "Europe/Brussels" };
const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) => (r.error?.issues ?? []).map((i) => i.message).join(" | ");

describe("site and façade fields of a project", () => {
  it("accept sky settings, twelve monthly turbidities and a façade's window, area and overhang", () => {
    const r = ProjectCreateRequest.safeParse({
      ...base,
      groundAlbedo: 0.3,
      skyModel: "hay-davies",
      linkeTurbidity: [3, 3.2, 3.5, 3.8, 4, 4.1, 4.2, 4.1, 3.9, 3.6, 3.2, 3],
      facades: [
        {
          name: "South",
          azimuthDeg: 180,
          glazedAreaM2: 120,
          windowWidthM: 1.5,
          windowHeightM: 2,
          shading: { overhang: { depthM: 0.6, gapAboveM: 0.2 } },
        },
      ],
    });
    expect(r.success, messages(r)).toBe(true);
    expect(r.data!.facades[0]).toMatchObject({ glazedAreaM2: 120, shading: { overhang: { depthM: 0.6 } } });
  });

  it("read empty number fields (NaN, '' or null from a form) as not given", () => {
    const r = ProjectCreateRequest.safeParse({
      ...base,
      facades: [{ name: "South", azimuthDeg: 180, glazedAreaM2: Number.NaN, windowWidthM: "", windowHeightM: null }],
    });
    expect(r.success, messages(r)).toBe(true);
    expect(r.data!.facades[0]!.glazedAreaM2).toBeNull();
  });

  it("refuse out-of-range values and half a window, naming the field in words", () => {
    expect(messages(ProjectUpdateRequest.safeParse({ groundAlbedo: 1.4 }))).toMatch(/Ground albedo/);
    expect(messages(ProjectUpdateRequest.safeParse({ linkeTurbidity: [3, 3] }))).toMatch(/twelve monthly values/);
    expect(messages(ProjectUpdateRequest.safeParse({ linkeTurbidity: Array(12).fill(12) }))).toMatch(/Linke turbidity/);
    expect(messages(ProjectUpdateRequest.safeParse({ skyModel: "cloudy" }))).toMatch(/Sky model/);
    expect(messages(ProjectCreateRequest.safeParse({ ...base, facades: [{ name: "S", azimuthDeg: 180, windowWidthM: 1.2 }] }))).toMatch(
      /width and height, or neither/,
    );
    expect(messages(ProjectCreateRequest.safeParse({ ...base, facades: [{ name: "S", azimuthDeg: 180, glazedAreaM2: -4 }] }))).toMatch(/Glazed area/);
  });
});
