// Independent computation of the diffuse view-factor check values (src/lib/reference-cases/shading-diffuse.ts).
//
// Formulas (sources in the case module):
//   crossed strings, window of height h below an infinitely long overhang of depth p at g above the head
//     (A sill, B head, C root, D tip): F = [(AC + BD) − (AD + BC)]/(2·AB) = (h + g + √(p² + g²) − √(p² + (h + g)²) − g)/(2h);
//   crossed strings, window of width w beside an infinitely tall fin of depth f set back e: F = (√(e² + f²) + w − √((w + e)² + f²))/(2w);
//   perpendicular rectangles with a common edge X (i is X × Y, j is X × Z), H = Z/X, W = Y/X:
//     F_ij = (1/(πW)) [W atan(1/W) + H atan(1/H) − √(H² + W²) atan(1/√(H² + W²)) + ¼ ln{ (1+W²)(1+H²)/(1+W²+H²)
//            · [W²(1+W²+H²)/((1+W²)(W²+H²))]^(W²) · [H²(1+H²+W²)/((1+H²)(H²+W²))]^(H²) }];
//   vertical window: sky factor 1 − 2F (the device takes F of the window's view, half of which is sky); two fins
//   take F each, half from the sky and half from the ground; tilt β: 1 − F/((1 + cos β)/2); horizontal: 1 − F.
//
// Run: npx tsx scripts/reference/shading-diffuse.ts
import { shadingDiffuse, SHADING_DIFFUSE_SCRIPT, type ShadingDiffuseInput } from "@/lib/reference-cases/shading-diffuse";
import { compareDomain, EXACT_BOUND, runWhenMain, type Recomputed } from "./compare";

const overhangStrings = (h: number, g: number, p: number): number => (h + g + Math.hypot(p, g) - Math.hypot(p, h + g) - g) / (2 * h);
const finStrings = (w: number, e: number, f: number): number => (Math.hypot(e, f) + w - Math.hypot(w + e, f)) / (2 * w);

function perpendicular(x: number, y: number, z: number): number {
  const H = z / x;
  const W = y / x;
  const s = H * H + W * W;
  const a = ((1 + W * W) * (1 + H * H)) / (1 + s);
  const b = Math.pow((W * W * (1 + s)) / ((1 + W * W) * s), W * W);
  const c = Math.pow((H * H * (1 + s)) / ((1 + H * H) * s), H * H);
  return (W * Math.atan(1 / W) + H * Math.atan(1 / H) - Math.sqrt(s) * Math.atan(1 / Math.sqrt(s)) + 0.25 * Math.log(a * b * c)) / (Math.PI * W);
}

/** The window-averaged sky, ground and horizon-band factors of one case. */
export function viewFactors(i: ShadingDiffuseInput): Recomputed {
  const w = i.windowWidthM;
  const h = i.windowHeightM;
  if (i.fins) {
    const f = finStrings(w, i.fins.gapFromJambM, i.fins.depthM);
    return {
      skyIsotropic: 1 - 2 * f,
      ground: 1 - 2 * f,
      horizonBand: (Math.hypot(w + i.fins.gapFromJambM, i.fins.depthM) - Math.hypot(i.fins.gapFromJambM, i.fins.depthM)) / w,
    };
  }
  const o = i.overhang!;
  const g = o.gapAboveHeadM ?? 0;
  const finite = o.extendLeftM !== undefined || o.extendRightM !== undefined;
  const F = finite
    ? ((h + g) * perpendicular(w, h + g, o.depthM) - g * (g > 0 ? perpendicular(w, g, o.depthM) : 0)) / h
    : overhangStrings(h, g, o.depthM);
  const tilt = (i.surfaceTiltDeg * Math.PI) / 180;
  const skyView = (1 + Math.cos(tilt)) / 2;
  return { skyIsotropic: 1 - F / skyView, ground: 1, horizonBand: 1 };
}

/** Every case of the domain, next to its recomputation. */
export const shadingDiffuseComparison = () =>
  compareDomain(shadingDiffuse, SHADING_DIFFUSE_SCRIPT, (c) => viewFactors(c.input), { rule: EXACT_BOUND, closedForm: false });

runWhenMain(import.meta.url, [[shadingDiffuse.title, shadingDiffuseComparison]]);
