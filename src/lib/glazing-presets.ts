/**
 * Starting make-ups for the composer. Generic, illustrative values — not any manufacturer's product:
 * clear float glass as n = 1.52 with a broadband absorption coefficient of 0.02 /mm (common practice,
 * no source), and one coated pane given by invented round-number measured values.
 */
import type { GlazingRequestInput } from "./contracts/glazing";

export interface Preset {
  id: string;
  label: string;
  request: GlazingRequestInput;
}

const clear = (thicknessMm: number) => ({ kind: "pane" as const, thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
const gap = (widthMm: number, gas: "air" | "argon" | "krypton" | { argon: number; air: number }) => ({ kind: "gap" as const, widthMm, gas });
/** Clear 4 mm float described by measured values: round illustrative numbers (common practice, no source). */
const clearMeasured = {
  kind: "pane" as const,
  thicknessMm: 4,
  measured: {
    solarTransmittance: 0.83,
    solarReflectanceFront: 0.075,
    solarReflectanceBack: 0.075,
    visibleTransmittance: 0.9,
    visibleReflectanceFront: 0.08,
    visibleReflectanceBack: 0.08,
  },
};
/** A soft-coated pane, coating towards the gap (face 3 of a double unit): invented illustrative values. */
const coatedInner = {
  kind: "pane" as const,
  thicknessMm: 4,
  emissivityFront: 0.03,
  measured: {
    solarTransmittance: 0.55,
    solarReflectanceFront: 0.27,
    solarReflectanceBack: 0.22,
    visibleTransmittance: 0.8,
    visibleReflectanceFront: 0.05,
    visibleReflectanceBack: 0.05,
  },
};

export const PRESETS: Preset[] = [
  { id: "single", label: "Single clear 6 mm", request: { layers: [clear(6)] } },
  { id: "double-air", label: "Double clear 4 | 16 air | 4", request: { layers: [clear(4), gap(16, "air"), clear(4)] } },
  {
    id: "double-lowe",
    label: "Double 4 | 16 argon 90 % | 4 coated (face 3)",
    request: { layers: [clearMeasured, gap(16, { argon: 0.9, air: 0.1 }), coatedInner] },
  },
  {
    id: "triple",
    label: "Triple clear 4 | 12 krypton | 4 | 12 krypton | 4",
    request: { layers: [clear(4), gap(12, "krypton"), clear(4), gap(12, "krypton"), clear(4)] },
  },
];
