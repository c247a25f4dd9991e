// The CSV checks of both uploads, without a database: every problem with its line (header = 1) and column,
// all at once; the rules of measured panes are the glazing contract's; local times in a zone with daylight saving.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { validatePanesCsv } from "@/lib/server/uploads/panes-csv";
import { engineWeather, validateWeatherCsv } from "@/lib/server/uploads/weather-csv";
import { PaneCreateRequest } from "@/lib/contracts/library";
import { zoneClock } from "@/lib/time/local-instant";
import { weatherCsv } from "@scripts/weather-year";

const fixture = (name: string) => readFileSync(new URL(`../fixtures/uploads/${name}`, import.meta.url));
const bytes = (text: string) => new TextEncoder().encode(text);
const where = (errors: { line: number; column: string }[]) => errors.map((e) => `${e.line} ${e.column}`);

describe("measured panes file", () => {
  it("reads every pane of a valid file, with light values alone, all three or none, and a note over two lines", () => {
    const r = validatePanesCsv(fixture("panes-valid.csv"));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.panes.map((p) => p.name)).toEqual(["Brightwater clear 6", "Brightwater solar grey 8", "Kestrel low-e 6"]);
    expect(r.panes[0]!.layer).toEqual({
      kind: "pane",
      thicknessMm: 6,
      emissivityFront: 0.837,
      emissivityBack: 0.837,
      measured: {
        solarTransmittance: 0.79,
        solarReflectanceFront: 0.072,
        solarReflectanceBack: 0.072,
        visibleTransmittance: 0.887,
        visibleReflectanceFront: 0.081,
        visibleReflectanceBack: 0.081,
      },
    });
    expect((r.panes[1]!.layer as { measured: object }).measured).toEqual({
      solarTransmittance: 0.41,
      solarReflectanceFront: 0.061,
      solarReflectanceBack: 0.089,
      visibleTransmittance: 0.46,
    });
    expect(r.panes[2]!.note).toBe("Coated face inside (face 2 of a double)\nmeasured 2026-03-11");
    // Each saved pane is what the single-pane endpoint's schema accepts.
    for (const p of r.panes) expect(PaneCreateRequest.safeParse(p).success).toBe(true);
  });

  it("names wrong, repeated and missing columns in the header, all at once", () => {
    const r = validatePanesCsv(fixture("panes-wrong-columns.csv"));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(where(r.errors)).toEqual(["1 thickness", "1 colour", "1 solar_t", "1 thickness_mm", "1 solar_rb"]);
    expect(r.errors[1]!.message).toContain("not a column");
    expect(r.errors[2]!.message).toContain("appears twice");
    expect(r.errors[3]!.message).toContain("missing");
  });

  it("reports text in numbers, T + R > 1, one light reflectance, no name, a decimal comma and an emissivity above 1 with line and column", () => {
    const r = validatePanesCsv(fixture("panes-broken.csv"));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(where(r.errors)).toEqual(["2 thickness_mm", "3 solar_rf", "4 light_rb", "5 solar_t", "6 emissivity_back"]);
    expect(r.errors[0]!.message).toBe("“six” is not a number");
    // The glazing contract's rule and message, in the file's column names.
    expect(r.errors[1]!.message).toBe("solar_t + solar_rf must not exceed 1");
    expect(r.errors[2]!.message).toBe("give the light reflectance of both faces, or neither");
    expect(r.errors[3]!.message).toContain("decimal point");
    expect(r.errors[4]!.message).toBe("emissivity_back must be at least 0.01 and at most 1");
  });

  it("reports a missing name once the numbers are right", () => {
    const r = validatePanesCsv(bytes("name,thickness_mm,solar_t,solar_rf,solar_rb\n,6,0.8,0.07,0.07\n"));
    expect(!r.ok && where(r.errors)).toEqual(["2 name"]);
  });

  it("refuses a file that is not UTF-8 and names its line", () => {
    const r = validatePanesCsv(
      new Uint8Array([...bytes("name,thickness_mm,solar_t,solar_rf,solar_rb\nA,6,0.8,0.07,0.07\nB"), 0xff, ...bytes(",6,0.8,0.07,0.07\n")]),
    );
    expect(!r.ok && r.errors[0]).toMatchObject({ line: 3, column: "(file)" });
  });
});

describe("weather file", () => {
  it("reads 8,760 hours with UTC instants and gives the engine each hour's midpoint", () => {
    const r = validateWeatherCsv(bytes(weatherCsv({ year: 2025, latitudeDeg: 38.7, longitudeDeg: -9.1, times: "utc" })), "Europe/Lisbon");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.weather.hours).toBe(8760);
    expect([r.weather.fromDate, r.weather.toDate]).toEqual(["2025-01-01", "2025-12-31"]);
    expect(engineWeather(r.weather.series)[0]!.time).toBe("2025-01-01T00:30:00.000Z");
  });

  it("reads local times across both clock changes when the repeated autumn hour carries its offset", () => {
    const text = weatherCsv({ year: 2025, latitudeDeg: 52.5, longitudeDeg: 13.4, times: "local", timeZone: "Europe/Berlin" });
    // Berlin 2025: 02:00 → 03:00 on 30 March, 03:00 → 02:00 on 26 October (EU summer-time rule, Directive 2000/84/EC).
    expect(text).not.toContain("2025-03-30 02:00");
    expect(text).toContain("2025-10-26T02:00+02:00");
    expect(text).toContain("2025-10-26T02:00+01:00");
    const r = validateWeatherCsv(bytes(text), "Europe/Berlin");
    expect(r.ok, JSON.stringify(!r.ok && r.errors.slice(0, 3))).toBe(true);
    if (r.ok) expect(r.weather.series.time[0]).toBe("2025-01-01T00:00:00.000Z");
  });

  it("reports the gap hour, a repeated hour, missing hours and each physical bound with line and column, all at once", () => {
    const r = validateWeatherCsv(fixture("weather-broken.csv"), "Europe/Lisbon");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(where(r.errors).sort()).toEqual(
      ["3 time", "6 time", "7 time", "8 ghi_wm2", "9 dni_wm2", "10 dhi_wm2", "11 ghi_wm2", "12 air_temperature_c"].sort(),
    );
    const at = (line: number) => r.errors.find((e) => e.line === line)!.message;
    expect(at(3)).toContain("does not exist in Europe/Lisbon");
    expect(at(6)).toContain("already on line 5");
    expect(at(7)).toBe("3 hours are missing between line 6 and this line (2025-03-30T03:00Z to 2025-03-30T05:00Z)".replace("line 6", "line 5"));
    expect(at(11)).toBe("“sunny” is not a number");
  });

  it("refuses the repeated autumn hour written without its offset", () => {
    const r = validateWeatherCsv(fixture("weather-autumn-ambiguous.csv"), "Europe/Lisbon");
    expect(!r.ok && where(r.errors)).toEqual(["3 time", "4 time"]);
    expect(!r.ok && r.errors[0]!.message).toContain("happens twice");
    expect(!r.ok && r.errors[0]!.message).toContain("2025-10-26T01:00+01:00");
  });

  it("refuses a period longer than the engine computes and a file with too many rows", () => {
    const long = weatherCsv({ year: 2024, latitudeDeg: 0, longitudeDeg: 0, times: "utc" }).trimEnd().split("\r\n");
    const extra = ["2025-01-01T00:00Z,0,0,0,", "2025-01-01T01:00Z,0,0,0,"];
    const r = validateWeatherCsv(bytes([...long, ...extra].join("\n")), "UTC");
    expect(!r.ok && r.errors[0]).toMatchObject({ column: "(file)", message: expect.stringContaining("more than 8784") });
  });
});

describe("zone clock", () => {
  it("finds none, one or two instants of a wall time", () => {
    const c = zoneClock("America/New_York");
    // US rule from 2007: clocks go forward 2:00 on the second Sunday of March, back 2:00 on the first Sunday of November (Energy Policy Act of 2005).
    expect(c.instantsOf({ year: 2025, month: 3, day: 9, hour: 2, minute: 30, second: 0 })).toEqual([]);
    expect(c.instantsOf({ year: 2025, month: 11, day: 2, hour: 1, minute: 30, second: 0 }).map((t) => new Date(t).toISOString())).toEqual([
      "2025-11-02T05:30:00.000Z",
      "2025-11-02T06:30:00.000Z",
    ]);
    expect(c.instantsOf({ year: 2025, month: 7, day: 1, hour: 12, minute: 0, second: 0 })).toEqual([Date.UTC(2025, 6, 1, 16)]);
  });
});

describe("templates offered by the upload forms", () => {
  const template = (name: string) => readFileSync(new URL(`../../public/templates/${name}`, import.meta.url));
  it("are valid files of their upload", () => {
    const panes = validatePanesCsv(template("paneray-panes-template.csv"));
    expect(panes.ok && panes.panes.length).toBe(4);
    const weather = validateWeatherCsv(template("paneray-weather-template.csv"), "Europe/Lisbon");
    expect(weather.ok && weather.weather.hours).toBe(24);
  });
});
