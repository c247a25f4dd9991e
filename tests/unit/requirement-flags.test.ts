// Requirement flags: pass / fail / unknown with margins. The check values are plain arithmetic on the
// inputs (common practice (no source)): margin = limit − value for a maximum, value − limit for a minimum.
import { describe, expect, it } from "vitest";
import { effectiveLimits, overallStatus, requirementFlags, type FlagInputs } from "@/lib/calc/requirement-flags";
import { Limits } from "@/lib/contracts/requirements";

const inputs: FlagInputs = { gValue: 0.42, lightTransmittance: 0.71, uValue: 1.1, peakTransmittedWm2: 412.5, annualSolarGainKWhm2: 380 };

describe("requirement flags", () => {
  it("gives one flag per limit set, in a fixed order, with its margin", () => {
    const flags = requirementFlags({ maxAnnualSolarGainKWhm2: 350, maxGValue: 0.45, minLightTransmittance: 0.7 }, inputs);
    expect(flags.map((f) => f.requirement)).toEqual(["maxGValue", "minLightTransmittance", "maxAnnualSolarGainKWhm2"]);
    expect(flags[0]).toMatchObject({ status: "pass", limit: 0.45, value: 0.42 });
    expect(flags[0]!.margin).toBeCloseTo(0.03, 12);
    expect(flags[1]).toMatchObject({ status: "pass" });
    expect(flags[1]!.margin).toBeCloseTo(0.01, 12);
    expect(flags[2]).toMatchObject({ status: "fail", margin: -30 });
  });

  it("fails a minimum below its limit and a maximum above it", () => {
    const flags = requirementFlags({ minLightTransmittance: 0.75, maxUValue: 1.0, maxPeakTransmittedWm2: 400 }, inputs);
    expect(flags.map((f) => f.status)).toEqual(["fail", "fail", "fail"]);
    expect(flags[0]!.margin).toBeCloseTo(-0.04, 12);
    expect(flags[1]!.margin).toBeCloseTo(-0.1, 12);
    expect(flags[2]!.margin).toBeCloseTo(-12.5, 12);
  });

  it("passes a value equal to its limit despite float noise (0.1 + 0.2 against 0.3)", () => {
    const [f] = requirementFlags({ maxGValue: 0.3 }, { ...inputs, gValue: 0.1 + 0.2 });
    expect(f).toMatchObject({ status: "pass", margin: 0 });
  });

  it("is unknown, never a pass, when the value is not known (τv without measured visible values)", () => {
    const flags = requirementFlags({ minLightTransmittance: 0.1, maxGValue: 1 }, { ...inputs, lightTransmittance: null, gValue: Number.NaN });
    expect(flags).toEqual([
      { requirement: "maxGValue", limit: 1, value: null, status: "unknown", margin: null },
      { requirement: "minLightTransmittance", limit: 0.1, value: null, status: "unknown", margin: null },
    ]);
    expect(overallStatus(flags)).toBe("unknown");
  });

  it("a τv known as a range passes or fails only when the whole range does", () => {
    const withRange = (low: number, high: number) => ({ ...inputs, lightTransmittance: null, lightTransmittanceRange: { low, high } });
    expect(requirementFlags({ minLightTransmittance: 0.6 }, withRange(0.63, 0.65))[0]).toMatchObject({ status: "pass", value: 0.63 });
    expect(requirementFlags({ minLightTransmittance: 0.6 }, withRange(0.63, 0.65))[0]!.margin).toBeCloseTo(0.03, 12);
    expect(requirementFlags({ minLightTransmittance: 0.7 }, withRange(0.63, 0.65))[0]).toMatchObject({ status: "fail", value: 0.65 });
    expect(requirementFlags({ minLightTransmittance: 0.64 }, withRange(0.63, 0.65))[0]).toMatchObject({
      status: "unknown",
      value: null,
      margin: null,
    });
  });

  it("checks nothing without limits", () => {
    expect(requirementFlags({}, inputs)).toEqual([]);
    expect(overallStatus([])).toBe("none");
  });

  it("a façade's overrides replace the project's limits key by key", () => {
    expect(effectiveLimits({ maxGValue: 0.5, maxUValue: 1.2 }, { maxGValue: 0.35, minLightTransmittance: 0.6 })).toEqual({
      maxGValue: 0.35,
      minLightTransmittance: 0.6,
      maxUValue: 1.2,
    });
    expect(effectiveLimits(undefined, undefined)).toEqual({});
  });

  it("the overall status is the worst: fail over unknown over pass", () => {
    const f = requirementFlags({ maxGValue: 0.5, minLightTransmittance: 0.5, maxUValue: 1 }, { ...inputs, lightTransmittance: null });
    expect(f.map((x) => x.status)).toEqual(["pass", "unknown", "fail"]);
    expect(overallStatus(f)).toBe("fail");
    expect(overallStatus(f.slice(0, 2))).toBe("unknown");
    expect(overallStatus(f.slice(0, 1))).toBe("pass");
  });

  it("the limits contract refuses out-of-range limits with the field named", () => {
    const r = Limits.safeParse({ maxGValue: 1.5 });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(["maxGValue"]);
  });
});
