// The three make-ups the results and workbook benches give their façades (invented bench data): a clear
// double, a tinted double with argon and a triple with one low-e face, described by glass properties.
export const pane = (thicknessMm: number, absorptionPerMm: number, emissivityBack?: number) => ({
  kind: "pane",
  thicknessMm,
  refractiveIndex: 1.52,
  absorptionPerMm,
  ...(emissivityBack ? { emissivityBack } : {}),
});
export const MAKEUPS = [
  { name: "Bench clear double", layers: [pane(6, 0.02), { kind: "gap", widthMm: 16, gas: "air" }, pane(4, 0.02)] },
  { name: "Bench tinted double", layers: [pane(6, 0.15), { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } }, pane(4, 0.02)] },
  {
    name: "Bench triple",
    layers: [
      pane(6, 0.02),
      { kind: "gap", widthMm: 14, gas: "argon" },
      pane(4, 0.02, 0.1),
      { kind: "gap", widthMm: 14, gas: "argon" },
      pane(4, 0.02),
    ],
  },
];
