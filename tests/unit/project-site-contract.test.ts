// The project contract's site and façade fields: sky settings, monthly turbidity, glazed area, the typical
// window and its shading devices; empty form fields are "not given", refusals name the field in words.
import { describe, expect, it } from "vitest";
import { FacadeShading, ProjectCreateRequest, ProjectUpdateRequest } from "@/lib/contracts/projects";
import { Shading } from "@/lib/contracts/schedule";

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

  it("name the shading devices' fields in words, with the façade's path", () => {
    const r = ProjectCreateRequest.safeParse({
      ...base,
      facades: [
        { name: "N", azimuthDeg: 0 },
        {
          name: "S",
          azimuthDeg: 180,
          windowWidthM: 1.5,
          windowHeightM: 2,
          shading: { overhang: { depthM: 80, gapAboveM: 0.2, extensionLeftM: -1 }, fins: { depthM: 0.3, gapM: 60 }, horizonDeg: 90 },
        },
      ],
    });
    expect(r.success).toBe(false);
    const byPath = Object.fromEntries(r.error!.issues.map((i) => [i.path.join("."), i.message]));
    expect(byPath).toEqual({
      "facades.1.shading.overhang.depthM": "Overhang depth (m) must be between 0 and 50",
      "facades.1.shading.overhang.extensionLeftM": "Overhang run past the left side (m) must be between 0 and 100",
      "facades.1.shading.fins.gapM": "Fin gap from the window edge (m) must be between 0 and 50",
      "facades.1.shading.horizonDeg": "Horizon angle (°) must be between 0 and 89",
    });
    expect(messages(FacadeShading.safeParse({ overhang: { gapAboveM: 0 } }))).toBe("Overhang depth (m) must be a number");
  });
});

describe("a façade's shading devices and the schedule engine's", () => {
  // The façade stores what the engine takes around its window: the same fields and ranges, only the words differ.
  const window = { widthM: 1.5, heightM: 2 };
  const samples: unknown[] = [
    {},
    { overhang: { depthM: 0.6, gapAboveM: 0.2 } },
    { overhang: { depthM: 50, gapAboveM: 0, extensionLeftM: 0, extensionRightM: 100 } },
    { overhang: { depthM: 50.01, gapAboveM: 0 } },
    { overhang: { depthM: 0.6, gapAboveM: 0.2, extensionRightM: 100.5 } },
    { overhang: { depthM: 0.6 } },
    { fins: { depthM: 0.4, gapM: 0 } },
    { fins: { depthM: -0.1, gapM: 0 } },
    { horizonDeg: 0 },
    { horizonDeg: 89 },
    { horizonDeg: 89.5 },
    { horizonDeg: "12" },
  ];
  it.each(samples.map((s) => [JSON.stringify(s), s]))("agree on %s", (_name, sample) => {
    const facade = FacadeShading.safeParse(sample);
    const engine = Shading.safeParse({ ...(sample as object), window });
    expect(facade.success).toBe(engine.success);
    if (facade.success) expect({ ...facade.data, window }).toEqual(engine.data);
    else expect(facade.error!.issues.map((i) => i.path.join("."))).toEqual(engine.error!.issues.map((i) => i.path.join(".")));
  });
});
