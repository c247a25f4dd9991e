// POST /api/v1/calc/schedule through the real server, and the project's sun and schedule page.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn } from "./helpers";

const pane = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const layers = [pane, { kind: "gap", widthMm: 16, gas: "air" }, pane];
const site = { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" };
const surface = { name: "South", azimuthDeg: 180, tiltDeg: 90, layers };

async function signInApi(request: APIRequestContext) {
  const res = await request.post("/api/auth/sign-in/email", { data: { email: demoUser("consultant").email, password: DEMO_PASSWORD } });
  expect(res.status()).toBe(200);
}

test("anonymous callers get 401", async ({ request }) => {
  expect((await request.post("/api/v1/calc/schedule", { data: { site, surfaces: [surface], from: "2026-06-21", to: "2026-06-21" } })).status()).toBe(
    401,
  );
});

test("a full year for one surface: 8,760 hourly rows with every column and the totals", async ({ request }) => {
  await signInApi(request);
  const res = await request.post("/api/v1/calc/schedule", {
    data: { site, surfaces: [surface], from: "2026-01-01", to: "2026-12-31" },
    timeout: 30_000,
  });
  expect(res.status()).toBe(200);
  const body = await res.json();
  const s = body.surfaces[0];
  expect(s.rows).toHaveLength(8760);
  expect(Object.keys(s.rows[4000]).sort()).toEqual(
    [
      "beamIncidentWm2",
      "beamTransmittance",
      "diffuseIncidentWm2",
      "incidenceDeg",
      "solarGainWm2",
      "sunAltitudeDeg",
      "sunAzimuthDeg",
      "sunlitFraction",
      "time",
      "transmittedWm2",
    ].sort(),
  );
  expect(s.rows[0].time).toBe("2026-01-01T00:30:00+00:00");
  expect(s.totals.monthly).toHaveLength(12);
  expect(s.totals.daily).toHaveLength(365);
  expect(s.totals.period.transmittedKWhPerM2).toBeGreaterThan(0);
  expect(body.methods.time).toMatch(/midpoint/);
});

test("bad input: 400 naming the field; too much work: 413", async ({ request }) => {
  await signInApi(request);
  const base = { site, surfaces: [surface], from: "2026-06-21", to: "2026-06-21" };
  const cases: [unknown, string][] = [
    [{ ...base, site: { ...site, timeZone: "Mars/Base" } }, "site.timeZone"],
    [{ ...base, site: { ...site, latitudeDeg: 95 } }, "site.latitudeDeg"],
    [{ ...base, from: "2026-02-30" }, "from"],
    [{ ...base, to: "2026-06-01" }, "to"],
    [{ ...base, stepMinutes: 7 }, "stepMinutes"],
    [{ ...base, surfaces: [] }, "surfaces"],
    [{ ...base, surfaces: [{ ...surface, tiltDeg: 200 }] }, "surfaces[0].tiltDeg"],
    [{ ...base, surfaces: [{ ...surface, layers: [pane, { kind: "gap", widthMm: 16, gas: "neon" }, pane] }] }, "surfaces[0].layers[1].gas"],
    [{ ...base, surfaces: [{ ...surface, shading: { window: { widthM: 0, heightM: 1 } } }] }, "surfaces[0].shading.window.widthM"],
    [{ ...base, sky: { model: "sunny" } }, "sky.model"],
    [{ ...base, weather: [{ time: "yesterday", ghi: 1, dni: 1, dhi: 1 }] }, "weather[0].time"],
    [{ ...base, from: "2026-01-01", to: "2027-12-31" }, "to"],
  ];
  for (const [body, field] of cases) {
    const res = await request.post("/api/v1/calc/schedule", { data: body as object });
    expect(res.status(), JSON.stringify(body).slice(0, 160)).toBe(400);
    const problem = await res.json();
    expect(
      problem.errors.map((e: { field: string }) => e.field),
      JSON.stringify(body).slice(0, 160),
    ).toContain(field);
  }
  const tooMuch = await request.post("/api/v1/calc/schedule", {
    data: { ...base, from: "2026-01-01", to: "2026-12-31", surfaces: Array.from({ length: 12 }, (_, k) => ({ ...surface, name: `S${k}` })) },
  });
  expect(tooMuch.status()).toBe(413);
  expect((await tooMuch.json()).detail).toMatch(/limit/);
});

test("the work limit is six surfaces for a whole leap year, computed by the built server's worker pool", async ({ request }) => {
  await signInApi(request);
  const leapYear = (n: number) => ({
    site,
    from: "2028-01-01",
    to: "2028-12-31",
    surfaces: Array.from({ length: n }, (_, k) => ({ ...surface, name: `S${k + 1}`, azimuthDeg: k * 60 })),
  });
  const six = await request.post("/api/v1/calc/schedule", { data: leapYear(6), timeout: 25_000 });
  expect(six.status()).toBe(200);
  const body = await six.json();
  expect(body.rowsPerSurface).toBe(8784);
  expect(body.surfaces.map((s: { rows: unknown[] }) => s.rows.length)).toEqual(Array(6).fill(8784));
  const seven = await request.post("/api/v1/calc/schedule", { data: leapYear(7) });
  expect(seven.status()).toBe(413);
  expect((await seven.json()).detail).toContain("61,488");
});

test("the project's sun page shows the sun path and a façade's year", async ({ page }) => {
  await signIn(page, demoUser("architect").email, DEMO_PASSWORD);
  await page.getByRole("link", { name: DEMO_PROJECTS[0].name }).click();
  await page.getByRole("link", { name: "Sun and schedules" }).click();
  await expect(page.getByRole("heading", { name: "Sun and hourly schedules" })).toBeVisible();
  const diagram = page.getByTestId("sun-path");
  await expect(diagram).toBeVisible();
  await expect(diagram.locator("[data-facade]")).toHaveCount(DEMO_PROJECTS[0].facades.length);
  await page.getByLabel("Façade", { exact: true }).selectOption({ index: 0 });
  await page.getByRole("button", { name: "Calculate the year" }).click();
  await expect(page.getByTestId("heatmap")).toBeVisible({ timeout: 20_000 });
  await expect(page.getByTestId("transmitted-total")).not.toHaveText("");
  await expect(page.getByTestId("monthly-table").locator("tbody tr")).toHaveCount(12);
  await expect(page.getByTestId("daily-profile")).toBeVisible();
  await page.getByLabel("Day", { exact: true }).fill(`${new Date().getFullYear()}-12-21`);
  await expect(page.getByTestId("day-table")).toContainText("12:30");
});
