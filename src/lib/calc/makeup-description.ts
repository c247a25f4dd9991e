/**
 * The short description of a make-up in the trade's usual notation, generated from its layers (never
 * typed): panes by nominal thickness in mm, gaps by width in mm and gas, outdoors first, separated by
 * " | ", e.g. "6 | 16 Ar 90% | 4 low-e #3". A face with an emissivity below 0.2 is a low-emissivity
 * coating and is marked with its face number counted from outdoors (#1 the outer face of the outer
 * pane). Measured panes are marked "(m)". Common practice (no source) for the notation.
 */
import type { Gap, Pane } from "@/lib/contracts/glazing";

/** Below this corrected emissivity a face counts as low-e (uncoated glass is 0.837). Common practice (no source). */
export const LOW_E_BELOW = 0.2;

const GAS_SYMBOLS: Record<string, string> = { air: "air", argon: "Ar", krypton: "Kr" };

const mm = (v: number) => String(Math.round(v * 10) / 10);

function gasText(gas: Gap["gas"]): string {
  if (typeof gas === "string") return GAS_SYMBOLS[gas] ?? gas;
  const parts = Object.entries(gas).filter(([, f]) => (f ?? 0) > 0) as [string, number][];
  if (parts.length === 1) return GAS_SYMBOLS[parts[0]![0]] ?? parts[0]![0];
  // The main fill gas and its share; air is the remainder, as filled units are described.
  const main = parts.filter(([g]) => g !== "air").sort((a, b) => b[1] - a[1]);
  if (main.length === 0) return "air";
  return main.map(([g, f]) => `${GAS_SYMBOLS[g] ?? g} ${Math.round(f * 100)}%`).join(" + ");
}

/** The faces (numbered from outdoors) of a pane that carry a low-e coating. */
export function lowEFaces(pane: Pick<Pane, "emissivityFront" | "emissivityBack">, paneIndex: number): number[] {
  const faces: number[] = [];
  if (pane.emissivityFront !== undefined && pane.emissivityFront < LOW_E_BELOW) faces.push(2 * paneIndex + 1);
  if (pane.emissivityBack !== undefined && pane.emissivityBack < LOW_E_BELOW) faces.push(2 * paneIndex + 2);
  return faces;
}

/** "6 | 16 Ar 90% | 4 low-e #3" for validated layers (pane, gap, pane, …). */
export function makeupDescription(layers: readonly (Pane | Gap)[]): string {
  let paneIndex = 0;
  return layers
    .map((layer) => {
      if (layer.kind === "gap") return `${mm(layer.widthMm)} ${gasText(layer.gas)}`;
      const i = paneIndex++;
      const faces = lowEFaces(layer, i);
      const measured = "measured" in layer ? " (m)" : "";
      const coating = faces.length ? ` low-e ${faces.map((f) => `#${f}`).join(" ")}` : "";
      return `${mm(layer.thicknessMm)}${measured}${coating}`;
    })
    .join(" | ");
}
