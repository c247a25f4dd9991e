// Reference tests for extraterrestrial irradiance, air mass, clear-sky models and transposition
// (src/lib/physics/irradiance.ts).
//
// Check values come from the Paneray physics handbook §12, which labels them:
//   [calc F12a–F12e] computed with python3 + numpy (float64) from the published formulas,
//   [pub]/[lib] published sources or pvlib-python's documented behaviour.
// Tolerance for printed values: half a unit in the last printed digit (the handbook's convention),
// via `printed()`. Two correct float64 implementations of the same formula agree to ~1e-12, so a
// failure at that tolerance means a formula or constant differs, not rounding.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  absoluteAirMass,
  beamOnSurface,
  clearSkyAshraeTau2009,
  clearSkyIneichenPerez2002,
  DEFAULT_MONTHLY_LINKE_TURBIDITY,
  emptyHayDavies1980SkyCoefficients,
  emptyPerez1990SkyCoefficients,
  extraterrestrialFactorSimple,
  extraterrestrialFactorSpencer1971,
  extraterrestrialIrradianceAshrae2009,
  extraterrestrialIrradianceSpencer1971,
  groundReflected,
  groundReflectedOnSurface,
  beamRatioHayDavies1980,
  skyCoefficientsHayDavies1980,
  skyDiffuseHayDavies1980,
  skyDiffuseIsotropicLiuJordan1960,
  PEREZ_1990_ALL_SITES_COMPOSITE,
  skyCoefficientsPerez1990,
  skyDiffusePerez1990,
  prepareTranspositionSurface,
  pressureFromElevation,
  relativeAirMassKastenYoung1989,
  skyDiffuseFromCoefficients,
  tiltedSurfaceIrradiance,
} from "@/lib/physics/irradiance";
import { angleOfIncidenceDeg } from "@/lib/physics/surface-geometry";
import { deg, printed } from "./fixtures";

const cosd = (d: number): number => Math.cos((d * Math.PI) / 180);

describe("extraterrestrial irradiance", () => {
  // Handbook §12 [calc F12a]: Spencer (1971) series as in pvlib get_extra_radiation('spencer'),
  // Esc = 1366.1 W/m² (pvlib's default); simple factor 1 + 0.033 cos(2π doy/365) (Duffie & Beckman
  // eq. 1.4.1a, from memory).
  const table: [number, string, string, string][] = [
    [1, "1.035050", "1413.98", "1.032995"],
    [80, "1.007900", "1376.89", "1.006351"],
    [172, "0.967443", "1321.62", "0.967538"],
    [266, "0.993046", "1356.60", "0.995611"],
    [355, "1.034118", "1412.71", "1.032512"],
  ];
  it.each(table)("doy %i: Spencer factor %s, E0 %s W/m², simple factor %s", (doy, factor, e0, simple) => {
    printed(extraterrestrialFactorSpencer1971(doy), factor);
    printed(extraterrestrialIrradianceSpencer1971(doy), e0);
    printed(extraterrestrialFactorSimple(doy), simple);
  });

  it("scales with the solar constant (closed form E0 = Esc · factor)", () => {
    expect(extraterrestrialIrradianceSpencer1971(172, 1361)).toBeCloseTo(1361 * extraterrestrialFactorSpencer1971(172), 12);
  });

  it("rejects a day of year outside [1, 367) naming it", () => {
    expect(() => extraterrestrialFactorSpencer1971(0)).toThrow(/day of year/);
    expect(() => extraterrestrialFactorSpencer1971(Number.NaN)).toThrow(RangeError);
    expect(() => extraterrestrialIrradianceSpencer1971(100, -5)).toThrow(/solar constant/);
  });
});

describe("air mass and pressure", () => {
  // Handbook §12 [calc F12b]: Kasten & Young, Applied Optics 28:4735 (1989), as in pvlib
  // get_relative_airmass (default model).
  const table: [number, string][] = [
    [0, "0.999712"],
    [30, "1.153992"],
    [60, "1.994293"],
    [70, "2.903147"],
    [75, "3.812912"],
    [80, "5.586036"],
    [85, "10.305791"],
    [88, "19.433245"],
    [90, "37.919608"],
  ];
  it.each(table)("AM(z = %i°) = %s", (z, am) => printed(relativeAirMassKastenYoung1989(z), am));

  it("AM(0) is not exactly 1, and sec z is far off near the horizon (handbook §12)", () => {
    expect(relativeAirMassKastenYoung1989(0)).not.toBe(1);
    // sec 80° = 5.7588 (handbook §12, closed form) against Kasten–Young 5.586036
    printed(1 / cosd(80), "5.7588");
    expect(Math.abs(relativeAirMassKastenYoung1989(80) - 1 / cosd(80))).toBeGreaterThan(0.17);
    expect(Number.isFinite(relativeAirMassKastenYoung1989(90))).toBe(true);
  });

  it("rejects a zenith below the horizon or not finite, naming it", () => {
    expect(() => relativeAirMassKastenYoung1989(90.5)).toThrow(/apparent zenith/);
    expect(() => relativeAirMassKastenYoung1989(-1)).toThrow(RangeError);
    expect(() => relativeAirMassKastenYoung1989(Number.NaN)).toThrow(RangeError);
  });

  it("absolute air mass = AM · p/101325 (closed form, pvlib get_absolute_airmass)", () => {
    expect(absoluteAirMass(2, 101325)).toBe(2);
    expect(absoluteAirMass(2, 50662.5)).toBeCloseTo(1, 14);
    expect(() => absoluteAirMass(2, 0)).toThrow(/pressure/);
    expect(() => absoluteAirMass(-1, 101325)).toThrow(/relative air mass/);
  });

  it("pressure from elevation follows pvlib alt2pres (standard atmosphere)", () => {
    // 101325 Pa at sea level is the formula's stated base pressure (pvlib alt2pres docs); the
    // fitted constants reproduce it to 0.002 Pa, hence the 0.01 Pa tolerance.
    expect(Math.abs(pressureFromElevation(0) - 101325)).toBeLessThan(0.01);
    // Handbook §12: "pvlib's alt2pres(1000) gives 89874.8 Pa" [calc; formula recalled, mem]
    printed(pressureFromElevation(1000), "89874.8");
    expect(() => pressureFromElevation(20000)).toThrow(/elevation/);
  });
});

describe("Ineichen–Perez clear sky", () => {
  // Handbook §12 [calc F12c]: I0 = 1364 W/m² (pvlib default), no enhancement factor; sea-level
  // rows use AM_abs = Kasten–Young AM.
  const seaLevel: [number, number, string, string, string][] = [
    [30, 3, "896.765", "916.450", "103.096"],
    [60, 3, "469.622", "787.807", "75.7186"],
    [30, 4, "857.597", "826.044", "142.222"],
  ];
  it.each(seaLevel)("z = %i°, TL = %i, sea level: GHI %s, DNI %s, DHI %s", (z, tl, ghi, dni, dhi) => {
    const r = clearSkyIneichenPerez2002({
      cosZenith: cosd(z),
      airMassAbsolute: absoluteAirMass(relativeAirMassKastenYoung1989(z), 101325),
      linkeTurbidity: tl,
      elevationM: 0,
      extraterrestrialWPerM2: 1364,
    });
    printed(r.ghi, ghi);
    printed(r.dni, dni);
    printed(r.dhi, dhi);
  });

  it("z = 30°, TL = 3, 1000 m, AM_abs = AM · exp(−1000/8434.5) = 1.024974: 941.563 / 962.598 / 107.928", () => {
    // Handbook §12: the 1000 m row uses AM_abs = AM·exp(−1000/8434.5), printed as 1.024974 so that
    // the test needs no pressure model. The printed GHI was computed from the unrounded AM_abs
    // (941.56251); the rounded 1.024974 shifts GHI by 6.5e-5 (∂GHI/∂AM ≈ −131 W/m² × 5e-7), which
    // is why the second check allows half a unit plus 1e-4.
    const amAbs = relativeAirMassKastenYoung1989(30) * Math.exp(-1000 / 8434.5);
    printed(amAbs, "1.024974");
    const input = { cosZenith: cosd(30), linkeTurbidity: 3, elevationM: 1000, extraterrestrialWPerM2: 1364 };
    const r = clearSkyIneichenPerez2002({ ...input, airMassAbsolute: amAbs });
    printed(r.ghi, "941.563");
    printed(r.dni, "962.598");
    printed(r.dhi, "107.928");
    const given = clearSkyIneichenPerez2002({ ...input, airMassAbsolute: 1.024974 });
    expect(Math.abs(given.ghi - 941.563)).toBeLessThan(5e-4 + 1e-4);
    expect(Math.abs(given.dni - 962.598)).toBeLessThan(5e-4 + 1e-4);
  });

  it("GHI = DNI cos z + DHI (closure, by definition) and zero at night", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 89.9, noNaN: true }), fc.double({ min: 1.5, max: 7, noNaN: true }), fc.double({ min: 0, max: 3000, noNaN: true }), (z, tl, h) => {
        const r = clearSkyIneichenPerez2002({
          cosZenith: cosd(z),
          airMassAbsolute: absoluteAirMass(relativeAirMassKastenYoung1989(z), pressureFromElevation(h)),
          linkeTurbidity: tl,
          elevationM: h,
          extraterrestrialWPerM2: 1361,
        });
        expect(Math.abs(r.ghi - (r.dni * cosd(z) + r.dhi))).toBeLessThan(1e-9);
        expect(r.dni).toBeGreaterThanOrEqual(0);
        expect(r.dhi).toBeGreaterThanOrEqual(-1e-9);
      }),
    );
    const night = clearSkyIneichenPerez2002({ cosZenith: -0.1, airMassAbsolute: Number.NaN, linkeTurbidity: 3, elevationM: 0, extraterrestrialWPerM2: 1361 });
    expect(night).toEqual({ ghi: 0, dni: 0, dhi: 0 });
  });

  it("the optional enhancement factor exp(0.01 AM^1.8) multiplies GHI (Ineichen & Perez 2002; pvlib perez_enhancement)", () => {
    const base = { cosZenith: cosd(60), airMassAbsolute: 1.994293, linkeTurbidity: 3, elevationM: 0, extraterrestrialWPerM2: 1364 };
    const plain = clearSkyIneichenPerez2002(base);
    const enhanced = clearSkyIneichenPerez2002({ ...base, perezEnhancement: true });
    expect(enhanced.ghi / plain.ghi).toBeCloseTo(Math.exp(0.01 * 1.994293 ** 1.8), 12);
  });

  it("rejects bad inputs naming the quantity", () => {
    const ok = { cosZenith: 0.8, airMassAbsolute: 1.2, linkeTurbidity: 3, elevationM: 0, extraterrestrialWPerM2: 1361 };
    expect(() => clearSkyIneichenPerez2002({ ...ok, linkeTurbidity: 0.5 })).toThrow(/Linke turbidity/);
    expect(() => clearSkyIneichenPerez2002({ ...ok, cosZenith: 1.5 })).toThrow(/cos zenith/);
    expect(() => clearSkyIneichenPerez2002({ ...ok, airMassAbsolute: Number.NaN })).toThrow(/absolute air mass/);
    expect(() => clearSkyIneichenPerez2002({ ...ok, elevationM: Number.POSITIVE_INFINITY })).toThrow(/elevation/);
    expect(() => clearSkyIneichenPerez2002({ ...ok, extraterrestrialWPerM2: 0 })).toThrow(/extraterrestrial/);
  });

  it("has 12 monthly Linke turbidity defaults within the model's usual range 2–7 (Remund et al. 2003 climatology spans ≈ 2–7; from memory)", () => {
    expect(DEFAULT_MONTHLY_LINKE_TURBIDITY).toHaveLength(12);
    for (const tl of DEFAULT_MONTHLY_LINKE_TURBIDITY) expect(tl >= 2 && tl <= 7).toBe(true);
  });
});

describe("ASHRAE tau clear-sky model", () => {
  // Handbook §12 [calc F12d], illustrative τb = 0.40, τd = 2.30, n = 172 (not a real site);
  // formula [pub: ASHRAE Handbook—Fundamentals 2009+, ch. 14, from memory].
  const e0 = extraterrestrialIrradianceAshrae2009(172);
  it("E0 = 1323.10, ab = 0.694520, ad = 0.230200", () => {
    printed(e0, "1323.10");
    const r = clearSkyAshraeTau2009({ airMass: 1, extraterrestrialWPerM2: e0, tauBeam: 0.4, tauDiffuse: 2.3 });
    printed(r.ab, "0.694520");
    printed(r.ad, "0.230200");
  });
  const rows: [number, string, string][] = [
    [60, "850.563", "122.810"],
    [30, "693.450", "89.2654"],
    [10, "353.056", "43.3893"],
  ];
  it.each(rows)("solar altitude %i°: Eb %s, Ed %s", (beta, eb, ed) => {
    // m = 1/[sin β + 0.50572 (6.07995 + β)^−1.6364] = Kasten–Young at z = 90° − β (same formula)
    const r = clearSkyAshraeTau2009({
      airMass: relativeAirMassKastenYoung1989(90 - beta),
      extraterrestrialWPerM2: e0,
      tauBeam: 0.4,
      tauDiffuse: 2.3,
    });
    printed(r.dniWPerM2, eb);
    printed(r.dhiWPerM2, ed);
  });
});

describe("transposition: the handbook worked example (vertical south façade)", () => {
  // Handbook §12 worked example [calc F12c + F10 + F12e]: doy 172 (E0 Spencer, 1366.1), z = 40°,
  // az_sun = 160°, vertical south façade, ρ_g = 0.2, TL = 3, sea level.
  const e0 = extraterrestrialIrradianceSpencer1971(172);
  const am = relativeAirMassKastenYoung1989(40);
  const sky = clearSkyIneichenPerez2002({
    cosZenith: cosd(40),
    airMassAbsolute: absoluteAirMass(am, 101325),
    linkeTurbidity: 3,
    elevationM: 0,
    extraterrestrialWPerM2: e0,
  });
  const thetaDeg = angleOfIncidenceDeg(50, 160, 180, 90);
  const cosTheta = cosd(thetaDeg);
  const hour = { dhiWPerM2: sky.dhi, dniWPerM2: sky.dni, extraterrestrialWPerM2: e0, zenithRad: deg(40) };
  const tilt = deg(90);

  it("intermediates: E0, AM, GHI, DNI, DHI, θ, beam, ground", () => {
    printed(e0, "1321.62");
    printed(am, "1.304224");
    printed(sky.ghi, "755.302");
    // The handbook prints DNI = 864.288; the unrounded value is 864.28747. Its own GHI and DHI
    // fix DNI = (GHI − DHI)/cos z ∈ [864.2873, 864.2875] (from 755.302 ± 5e-4 and 93.2191 ± 5e-5),
    // so the printed last digit looks double-rounded (864.28747 → 864.2875 → 864.288). We allow one
    // unit in the last printed digit here and check the closure against the printed GHI and DHI.
    expect(Math.abs(sky.dni - 864.288)).toBeLessThan(1e-3);
    expect(Math.abs((755.302 - 93.2191) / cosd(40) - sky.dni)).toBeLessThan((5e-4 + 5e-5) / cosd(40));
    printed(sky.dhi, "93.2191");
    // θ = acos(sin 40° cos 20°) = 52.841446°; the handbook prints 52.8415 (again consistent with
    // double rounding, 52.84145 → 52.8415), so one unit in the last digit here; cos θ below is
    // checked at the usual half unit.
    expect(Math.abs(thetaDeg - 52.8415)).toBeLessThan(1e-4);
    printed(cosTheta, "0.604023");
    printed(beamOnSurface(sky.dni, cosTheta), "522.049");
    printed(groundReflected(sky.ghi, tilt, 0.2), "75.5302");
  });

  it("sky diffuse: isotropic 46.6095; Hay–Davies 64.1966 (Ai 0.653959, Rb 0.788496)", () => {
    printed(skyDiffuseIsotropicLiuJordan1960(sky.dhi, tilt), "46.6095");
    const hd = skyCoefficientsHayDavies1980(hour);
    printed(hd.anisotropyIndex, "0.653959");
    printed(beamRatioHayDavies1980(cosTheta, deg(40)), "0.788496");
    printed(skyDiffuseHayDavies1980(hour, tilt, cosTheta), "64.1966");
  });

  it("sky diffuse: Perez 78.4092 (ε 7.84647 → bin 8, Δ 0.0919920, F1 0.473386, F2 0.204558)", () => {
    const p = skyCoefficientsPerez1990(hour, am);
    printed(p.epsilon, "7.84647");
    expect(p.bin).toBe(8);
    // The handbook's Δ = 0.0919920 is reproduced with its printed E0 = 1321.62; the unrounded
    // E0 = 1321.6236 gives 0.0919918 (relative difference 2.7e-6 = the rounding of E0). F1, F2 and
    // the totals are insensitive to this at their printed precision.
    printed(skyCoefficientsPerez1990({ ...hour, extraterrestrialWPerM2: 1321.62 }, am).delta, "0.0919920");
    expect(Math.abs(p.delta - 0.091992) / 0.091992).toBeLessThan(3e-6);
    printed(p.f1, "0.473386");
    printed(p.f2, "0.204558");
    printed(skyDiffusePerez1990(hour, am, tilt, cosTheta), "78.4092");
  });

  it.each([
    ["isotropic", "644.189"],
    ["hay-davies", "661.776"],
    ["perez", "675.989"],
  ] as const)("total on the façade, %s: %s W/m²", (model, total) => {
    const r = tiltedSurfaceIrradiance({ ...hour, ghiWPerM2: sky.ghi, relativeAirMass: am, tiltRad: tilt, cosTheta, albedo: 0.2, model });
    printed(r.totalWPerM2, total);
    expect(r.beamWPerM2 + r.skyDiffuseWPerM2 + r.groundWPerM2).toBe(r.totalWPerM2);
  });
});

describe("transposition: consistency and hot path", () => {
  it("Rb = 0.5 makes Hay–Davies equal to isotropic on a vertical façade (handbook §12: non-discriminating case)", () => {
    // sun az 150°, z 30°, south façade: cos θ = sin 30° cos 30° = 0.4330, cos z = 0.8660 → Rb = 0.5,
    // so DHI [Ai/2 + (1 − Ai)/2] = DHI/2 for every Ai (closed form). A consistency check only.
    const cosTheta = cosd(angleOfIncidenceDeg(60, 150, 180, 90));
    expect(beamRatioHayDavies1980(cosTheta, deg(30))).toBeCloseTo(0.5, 12);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 500, noNaN: true }), fc.double({ min: 0, max: 1000, noNaN: true }), (dhi, dni) => {
        const hd = skyDiffuseHayDavies1980({ dhiWPerM2: dhi, dniWPerM2: dni, extraterrestrialWPerM2: 1361, zenithRad: deg(30) }, deg(90), cosTheta);
        expect(Math.abs(hd - skyDiffuseIsotropicLiuJordan1960(dhi, deg(90)))).toBeLessThan(1e-9 * (1 + dhi));
      }),
    );
  });

  it("per-surface-hour forms equal the scalar forms (property, random skies and surfaces)", () => {
    const perezOut = emptyPerez1990SkyCoefficients();
    const hdOut = emptyHayDavies1980SkyCoefficients();
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 89.5, noNaN: true }),
        fc.double({ min: 0, max: 600, noNaN: true }),
        fc.double({ min: 0, max: 1100, noNaN: true }),
        fc.double({ min: 0, max: 180, noNaN: true }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (zDeg, dhi, dni, tiltDeg, cosTheta, albedo) => {
          const hour = { dhiWPerM2: dhi, dniWPerM2: dni, extraterrestrialWPerM2: 1361, zenithRad: deg(zDeg) };
          const am = relativeAirMassKastenYoung1989(zDeg);
          const surface = prepareTranspositionSurface(deg(tiltDeg), albedo);
          const tol = 1e-9 * (1 + dhi);
          const fastP = skyDiffuseFromCoefficients(skyCoefficientsPerez1990(hour, am, perezOut), surface, cosTheta);
          expect(Math.abs(fastP - skyDiffusePerez1990(hour, am, deg(tiltDeg), cosTheta))).toBeLessThan(tol);
          const fastH = skyDiffuseFromCoefficients(skyCoefficientsHayDavies1980(hour, hdOut), surface, cosTheta);
          expect(Math.abs(fastH - skyDiffuseHayDavies1980(hour, deg(tiltDeg), cosTheta))).toBeLessThan(tol);
          const iso = { isotropicWPerM2: dhi, circumsolarPerCos: 0, horizonWPerM2: 0 };
          expect(Math.abs(skyDiffuseFromCoefficients(iso, surface, cosTheta) - skyDiffuseIsotropicLiuJordan1960(dhi, deg(tiltDeg)))).toBeLessThan(tol);
          expect(Math.abs(groundReflectedOnSurface(dhi + dni, surface) - groundReflected(dhi + dni, deg(tiltDeg), albedo))).toBeLessThan(tol);
        },
      ),
    );
  });

  it("the `out` records are filled in place (no allocation per hour)", () => {
    const out = emptyPerez1990SkyCoefficients();
    const hour = { dhiWPerM2: 100, dniWPerM2: 600, extraterrestrialWPerM2: 1361, zenithRad: deg(40) };
    expect(skyCoefficientsPerez1990(hour, 1.3, out)).toBe(out);
    const hd = emptyHayDavies1980SkyCoefficients();
    expect(skyCoefficientsHayDavies1980(hour, hd)).toBe(hd);
  });

  it("horizontal surface: every model gives DHI (closed form: cos θ = cos z, so Rb = 1, and the Perez terms reduce to DHI)", () => {
    // Perez on a horizontal plane: (1 − F1) + F1 cos z / max(cos 85°, cos z) + 0 = 1 for z ≤ 85°.
    const hour = { dhiWPerM2: 120, dniWPerM2: 700, extraterrestrialWPerM2: 1361, zenithRad: deg(35) };
    expect(skyDiffuseHayDavies1980(hour, 0, cosd(35))).toBeCloseTo(120, 10);
    expect(skyDiffusePerez1990(hour, relativeAirMassKastenYoung1989(35), 0, cosd(35))).toBeCloseTo(120, 10);
    expect(skyDiffuseIsotropicLiuJordan1960(120, 0)).toBe(120);
    expect(groundReflected(800, 0)).toBe(0);
  });

  it("Perez: bins follow numpy.digitize on the published edges (an edge value goes to the upper bin); DHI = 0 gives 0", () => {
    // z = 0 → ε = (DHI + DNI)/DHI exactly; 106.5/100 = 1.065 (edge of bins 1|2), 6.2 edge of 7|8.
    const at = (dni: number) => skyCoefficientsPerez1990({ dhiWPerM2: 100, dniWPerM2: dni, extraterrestrialWPerM2: 1361, zenithRad: 0 }, 1).bin;
    expect(at(0)).toBe(1);
    expect(at(6.5)).toBe(2);
    expect(at(520)).toBe(8);
    expect(at(519)).toBe(7);
    const none = skyCoefficientsPerez1990({ dhiWPerM2: 0, dniWPerM2: 800, extraterrestrialWPerM2: 1361, zenithRad: deg(30) }, 1.15);
    expect([none.isotropicWPerM2, none.circumsolarPerCos, none.horizonWPerM2]).toEqual([0, 0, 0]);
  });

  it("holds the published Perez 1990 all-sites-composite table (handbook §12, copied from Perez et al. 1990)", () => {
    // spot checks of the first and last rows as printed in the handbook
    expect(PEREZ_1990_ALL_SITES_COMPOSITE).toHaveLength(8);
    expect(PEREZ_1990_ALL_SITES_COMPOSITE[0]).toEqual([-0.008, 0.588, -0.062, -0.06, 0.072, -0.022]);
    expect(PEREZ_1990_ALL_SITES_COMPOSITE[7]).toEqual([0.678, -0.327, -0.25, 0.156, -1.377, 0.251]);
  });

  it("rejects bad inputs naming the quantity", () => {
    const hour = { dhiWPerM2: 100, dniWPerM2: 600, extraterrestrialWPerM2: 1361, zenithRad: deg(40) };
    expect(() => skyCoefficientsPerez1990({ ...hour, dhiWPerM2: -1 }, 1.3)).toThrow(/DHI/);
    expect(() => skyCoefficientsPerez1990(hour, 0)).toThrow(/relative air mass/);
    expect(() => skyCoefficientsHayDavies1980({ ...hour, dniWPerM2: Number.NaN })).toThrow(/DNI/);
    expect(() => skyCoefficientsHayDavies1980({ ...hour, zenithRad: 4 })).toThrow(/solar zenith/);
    expect(() => prepareTranspositionSurface(deg(200))).toThrow(/surface tilt/);
    expect(() => prepareTranspositionSurface(deg(90), 1.5)).toThrow(/ground albedo/);
    expect(() => tiltedSurfaceIrradiance({ ...hour, ghiWPerM2: 500, tiltRad: deg(90), cosTheta: 0.5, model: "perez" })).toThrow(/relative air mass/);
    expect(() => tiltedSurfaceIrradiance({ ...hour, ghiWPerM2: 500, tiltRad: deg(90), cosTheta: 1.5, model: "isotropic" })).toThrow(/cos incidence/);
  });
});
