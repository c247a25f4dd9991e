// POST /api/v1/calc/glazing through the real server, and the make-up page in the browser.
// Check values, read from the reference cases by id with their tolerances:
// - optics: the layer-stack and hemispherical cases of two 6 mm panes (src/lib/reference-cases/layer-stack.ts,
//   hemispherical.ts), computed by scripts/reference/layer-stack.ts and hemispherical.ts from the Fresnel
//   equations, the slab series and the net-radiation method per polarisation;
// - g: the g-value case of 6 | 16 air | 6 at 0° (src/lib/reference-cases/g-value.ts), EN 410:2011 g computed by
//   scripts/reference/g-value.ts (formulae from memory);
// - U: the u-value cases (src/lib/reference-cases/u-value.ts), EN 673:2011 computed by
//   scripts/reference/u-value.ts (equations and constants from memory), declared to one decimal as the page shows it.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { gValueDomain } from "@/lib/reference-cases/g-value";
import { double6mmCase } from "@/lib/reference-cases/hemispherical";
import { double0Case } from "@/lib/reference-cases/layer-stack";
import { caseById, expectedOf } from "@/lib/reference-cases/read";
import type { ExpectedValue } from "@/lib/reference-cases/types";
import { uValueDomain } from "@/lib/reference-cases/u-value";
import { DEMO_PASSWORD, demoUser, signIn } from "./helpers";

/** |actual − expected| below the case's tolerance (half a unit in its last printed decimal). */
const expectWithin = (actual: number, e: ExpectedValue) =>
  expect(Math.abs(actual - e.value), `${e.quantity}: expected ${e.value} ± ${e.tolerance.abs}, got ${actual}`).toBeLessThan(e.tolerance.abs);

/** U declared to one decimal, as the page prints it, from a u-value case. */
const declaredU = (id: string): string => expectedOf(caseById(uValueDomain.cases, id), "uValueRoundedToTenth").value.toFixed(1);

/** g of double 6 | 16 air | 6 at 0°. */
const gDouble0 = expectedOf(caseById(gValueDomain.cases, "g-value/double-6-16air-6/0deg"), "gValue");

const pane6 = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const air16 = { kind: "gap", widthMm: 16, gas: "air" };

async function signInApi(request: APIRequestContext) {
  const res = await request.post("/api/auth/sign-in/email", { data: { email: demoUser("consultant").email, password: DEMO_PASSWORD } });
  expect(res.status()).toBe(200);
}

test("anonymous callers get 401", async ({ request }) => {
  const res = await request.post("/api/v1/calc/glazing", { data: { layers: [pane6] } });
  expect(res.status()).toBe(401);
});

test("a double glazing answers the contract with the reference values", async ({ request }) => {
  await signInApi(request);
  const res = await request.post("/api/v1/calc/glazing", { data: { layers: [pane6, air16, pane6] } });
  expect(res.status()).toBe(200);
  const body = await res.json();
  expect(body.angles.map((a: { angleDeg: number }) => a.angleDeg)).toEqual([0, 10, 20, 30, 40, 50, 60, 70, 80, 90]);
  const n = body.angles[0];
  expect(Object.keys(n)).toEqual(
    expect.arrayContaining(["angleDeg", "solarTransmittance", "solarReflectanceFront", "solarReflectanceBack", "layerAbsorptance", "gValue"]),
  );
  // T at 0°: the layer-stack case of two 6 mm panes, within its tolerance
  expectWithin(n.solarTransmittance, expectedOf(double0Case, "T"));
  // g at 0°: the g-value case, to half a unit in its 6th printed decimal. The case itself allows 1.5e-6 because it
  // feeds the rounded optics to the EN 410 formula; the API computes g from unrounded optics.
  expect(n.gValue).toBeCloseTo(gDouble0.value, 6);
  expect(n.layerAbsorptance).toHaveLength(2);
  expect(body.angles[9].solarTransmittance).toBe(0); // grazing incidence: nothing enters
  // hemispherical T: the hemispherical case of two 6 mm panes, within its tolerance
  expectWithin(body.hemispherical.solarTransmittance, expectedOf(double6mmCase, "T"));
  expect(Object.keys(body.hemispherical)).toEqual(
    expect.arrayContaining(["solarTransmittance", "solarReflectanceFront", "layerAbsorptance", "gValue"]),
  );
  // No case holds U of 6 | 16 air | 6: a plausibility band around the 4 | 16 air | 4 case (u-value/4-16air-4), whose
  // 2 mm thinner panes change U by a few hundredths (common practice, no source).
  expect(body.uValue).toBeGreaterThan(2.6);
  expect(body.uValue).toBeLessThan(2.8);
  expect(Array.isArray(body.warnings)).toBe(true);
});

test("bad input is answered 400 naming the field (413 when huge), never 500", async ({ request }) => {
  await signInApi(request);
  const cases: [unknown, string][] = [
    [{ layers: [air16] }, "layers[0].kind"],
    [{ layers: [] }, "layers"],
    [{ layers: [pane6, air16] }, "layers[1]"],
    [{ layers: [{ ...pane6, thicknessMm: -4 }] }, "layers[0].thicknessMm"],
    [{ layers: [{ ...pane6, thicknessMm: "4" }] }, "layers[0].thicknessMm"],
    [{ layers: [{ ...pane6, refractiveIndex: 1e9 }] }, "layers[0].refractiveIndex"],
    [{ layers: [{ ...pane6, absorptionPerMm: null }] }, "layers[0].absorptionPerMm"],
    [{ layers: [{ ...pane6, emissivityFront: 0 }] }, "layers[0].emissivityFront"],
    [{ layers: [pane6, { ...air16, gas: "helium" }, pane6] }, "layers[1].gas"],
    [{ layers: [pane6, { ...air16, gas: { argon: 0.5, air: 0.2 } }, pane6] }, "layers[1].gas"],
    [{ layers: [pane6, { ...air16, widthMm: 1e6 }, pane6] }, "layers[1].widthMm"],
    [
      { layers: [{ kind: "pane", thicknessMm: 4, measured: { solarTransmittance: 0.9, solarReflectanceFront: 0.2, solarReflectanceBack: 0.1 } }] },
      "layers[0].measured.solarReflectanceFront",
    ],
    [{ layers: Array.from({ length: 13 }, (_, i) => (i % 2 ? air16 : pane6)) }, "layers"],
    [{ layers: [pane6], anglesDeg: [0, 91] }, "anglesDeg[1]"],
    [{ layers: [pane6], anglesDeg: "all" }, "anglesDeg"],
    [[pane6], "(body)"],
  ];
  for (const [body, field] of cases) {
    const res = await request.post("/api/v1/calc/glazing", { data: body as object });
    expect(res.status(), JSON.stringify(body).slice(0, 120)).toBe(400);
    const problem = await res.json();
    expect(
      problem.errors.map((e: { field: string }) => e.field),
      JSON.stringify(body).slice(0, 120),
    ).toContain(field);
  }
  const huge = await request.post("/api/v1/calc/glazing", {
    data: { layers: [pane6], anglesDeg: Array.from({ length: 20_000 }, () => 45.123456789) },
  });
  expect(huge.status()).toBe(413);
  const broken = await request.post("/api/v1/calc/glazing", { headers: { "content-type": "application/json" }, data: '{"layers": [' });
  expect(broken.status()).toBe(400);
});

test("the make-up page recalculates as the consultant edits", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.getByRole("link", { name: "Glazing" }).click();
  await expect(page.getByRole("heading", { name: "Glazing make-up" })).toBeVisible();
  // The first result shows once the island is live (hydrated) and has calculated the default make-up.
  await expect(page.getByTestId("g-normal")).toBeVisible();
  await page.getByLabel("Start from").selectOption("double-air");
  const g = page.getByTestId("g-normal");
  const u = page.getByTestId("u-value");
  await expect(u).toHaveText(declaredU("u-value/4-16air-4")); // 4 | 16 air | 4
  const gBefore = await g.textContent();
  await expect(page.locator('[data-series="T"]')).toHaveCount(1);
  await expect(page.locator('[data-series="A2"]')).toHaveCount(1);

  // Argon fill lowers U: the gap is selected on the section drawing and edited beside it.
  const section = page.getByTestId("makeup-section");
  await section.locator('[data-layer="1"]').click();
  await expect(page.getByTestId("gap-inspector")).toBeVisible();
  await page.locator("#layers\\.1-gas").selectOption("argon");
  await page.locator("#layers\\.1-fill").fill("100");
  await expect(u).toHaveText(declaredU("u-value/4-16ar-4")); // 4 | 16 argon | 4
  await expect(page.getByTestId("composer-description")).toHaveText("4 | 16 Ar | 4");

  // An invalid value is flagged at the field, in words, the layer is outlined on the drawing and the last good result stays.
  await section.locator('[data-layer="0"]').click();
  await page.locator("#layers\\.0\\.thicknessMm").fill("-3");
  await expect(page.locator('[data-field="layers.0.thicknessMm"]')).toContainText("Thickness (mm) must be at least 0.5");
  await expect(section.locator('[data-layer="0"]')).toHaveAttribute("data-invalid", "1");
  await expect(u).toHaveText(declaredU("u-value/4-16ar-4"));
  // From another layer the problem is listed and leads back to it.
  await section.locator('[data-layer="2"]').click();
  await page
    .getByTestId("other-problems")
    .getByRole("button", { name: /Pane 1: Thickness/ })
    .click();
  await expect(page.locator("#layers\\.0\\.thicknessMm")).toBeFocused();

  // A thicker outer pane absorbs more and transmits less: g falls.
  await page.locator("#layers\\.0\\.thicknessMm").fill("12");
  await expect(g).not.toHaveText(gBefore!);
  await expect(page.getByTestId("summary-table")).toContainText("Absorptance, pane 2");

  // The readout follows the angle chosen: at 60° less is transmitted than at 0°.
  const tau = () => page.getByTestId("summary-table").locator("tbody tr").first().locator("td").nth(1);
  const tau0 = Number(await tau().textContent());
  await page.getByLabel(/Angle of incidence/).fill("60");
  await expect(page.getByTestId("readout-angle")).toHaveText("at 60°");
  await expect.poll(async () => Number(await tau().textContent())).toBeLessThan(tau0);
  // The shares of the sun at that angle add up to 1 (energy balance), within the 3-decimal rounding shown.
  const shares = await page.getByTestId("sun-budget").locator("li span.font-bold").allTextContents();
  expect(Math.abs(shares.reduce((a, x) => a + Number(x), 0) - 1)).toBeLessThan(0.003);

  // Add a third pane on the room side; it opens in the inspector.
  await page.getByRole("button", { name: "+ pane on the room side" }).click();
  await expect(section.locator('[aria-label^="Pane "]')).toHaveCount(3);
  await expect(page.getByTestId("pane-inspector")).toContainText("Pane 3");
  await expect(page.locator('[data-series="A3"]')).toHaveCount(1);
  await expect(page.getByText("not certified or declared values")).toBeVisible();
});

test("switching how a pane is described keeps the make-up valid", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.goto("/glazing");
  const g = page.getByTestId("g-normal");
  await expect(g).toBeVisible();
  await page.getByLabel("Start from").selectOption("double-lowe");
  // low-e 0.03 on face 3, 90 % argon; the case has the coating on face 2, and EN 673 h_r is symmetric in the two gap faces
  await expect(page.getByTestId("u-value")).toHaveText(declaredU("u-value/4-16ar90-4-e0.03"));
  const before = await g.textContent();
  // The coated room-side pane becomes clear glass described by its properties: more sun comes in.
  await page.getByTestId("makeup-section").locator('[data-layer="2"]').click();
  const described = page.getByRole("group", { name: "How pane 2 is described" });
  await described.getByLabel("by its glass").check();
  await expect(g).not.toHaveText(before!);
  await expect(page.locator(".field-error")).toHaveCount(0);
  await described.getByLabel("by data-sheet values").check();
  await expect(page.locator("#layers\\.2\\.measured\\.solarTransmittance")).toHaveValue("0.8");
  await page.getByRole("button", { name: "Remove pane 2" }).click();
  await expect(page.getByTestId("makeup-section").locator('[aria-label^="Pane "]')).toHaveCount(1);
  await expect(page.getByTestId("u-value")).toHaveText(declaredU("u-value/single-4")); // single 4 mm
});

test("a pane known by its light transmittance alone is accepted, its light reflectance reported unknown", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.goto("/glazing");
  await expect(page.getByTestId("g-normal")).toBeVisible();
  await page.getByLabel("Start from").selectOption("double-lowe");
  const light = page.getByTestId("light-normal");
  await expect(light).toHaveText(/^0\.\d\d$/);
  // The coated pane's data sheet lists τv only: its light reflectances are cleared.
  await page.getByTestId("makeup-section").locator('[data-layer="2"]').click();
  await page.locator("#layers\\.2\\.measured\\.visibleReflectanceFront").fill("");
  await page.locator("#layers\\.2\\.measured\\.visibleReflectanceBack").fill("");
  await expect(page.locator(".field-error")).toHaveCount(0);
  // The unit's τv is then a range, bounded by what the unknown reflectances can be.
  await expect(light).toHaveText(/^0\.\d\d–0\.\d\d$/);
  await expect(page.getByTestId("readings")).toContainText("light reflectance of some panes unknown");
  await expect(page.getByTestId("warnings")).toContainText("τv at normal incidence lies between");
  // One reflectance without the other is refused, in words.
  await page.locator("#layers\\.2\\.measured\\.visibleReflectanceFront").fill("0.05");
  await expect(page.locator('[data-field="layers.2.measured.visibleReflectanceBack"]')).toContainText(
    "Give the light reflectance of both faces, or neither",
  );
});
