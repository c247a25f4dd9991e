// Independent computation of the overhang/fin beam-shading check values (src/lib/reference-cases/shading.ts).
//
// Formula: shadow geometry of infinitely long overhangs and full-height side fins on a vertical window,
// ASHRAE Handbook—Fundamentals, fenestration chapter (from memory):
//   horizontal shadow angle γ = az_sun − az_façade, wrapped to (−180°, 180°];
//   profile (vertical shadow) angle Ω: tan Ω = tan(alt)/cos γ;
//   overhang band at the head h_s = clamp(P tan Ω − G, 0, H); fin strip at the jamb w_s = clamp(F |tan γ| − E, 0, W);
//   sunlit fraction f = (W − w_s)(H − h_s)/(W H) when |γ| < 90° and alt > 0, else 0.
//
// Run: npx tsx scripts/reference/shading.ts
import { shading, type ShadingInput } from "@/lib/reference-cases/shading";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const SCRIPT = "scripts/reference/shading.ts";
const D2R = Math.PI / 180;
const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));

/** Shaded band, strip and sunlit fractions of the window for one sun position. */
export function shadowGeometry(i: ShadingInput): Record<string, number> {
  const gammaDeg = ((((i.sunAzimuthDeg - i.surfaceAzimuthDeg + 180) % 360) + 360) % 360) - 180;
  const g = gammaDeg * D2R;
  const lit = i.sunAltitudeDeg > 0 && Math.abs(gammaDeg) < 90;
  const tanOmega = Math.tan(i.sunAltitudeDeg * D2R) / Math.cos(g);
  const W = i.windowWidthM;
  const H = i.windowHeightM;
  const drop = i.overhang.depthM * tanOmega;
  // Behind the façade (|γ| ≥ 90°) the band and strip are the whole window.
  const hs = lit ? clamp(drop - i.overhang.gapAboveHeadM, 0, H) : H;
  const ws = lit ? clamp(i.fins.depthM * Math.abs(Math.tan(g)) - i.fins.gapFromJambM, 0, W) : W;
  const frac = (h: number, w: number) => (lit ? ((W - w) * (H - h)) / (W * H) : 0);
  return {
    horizontalShadowAngleDeg: gammaDeg,
    tanProfileAngle: tanOmega,
    profileAngleDeg: Math.atan(tanOmega) / D2R,
    shadowDropM: drop,
    overhangShadedHeightM: hs,
    finShadedWidthM: ws,
    sunlitFraction: frac(hs, ws),
    sunlitFractionOverhangOnly: frac(hs, 0),
    sunlitFractionFinsOnly: frac(0, ws),
  };
}

export const computeShading = (c: ReferenceCase<ShadingInput>): Recomputed => shadowGeometry(c.input);

/** Every case of the domain this script answers for, next to its recomputation. */
export const shadingComparison = () => compareDomain(shading, SCRIPT, computeShading, { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[shading.title, shadingComparison]]);
