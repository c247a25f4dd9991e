/**
 * The model panes of the optics and g-value cases, in the units printed with the cases. Pure data.
 */

/** An uncoated pane: thickness in millimetres, broadband refractive index, and the natural-log (Beer–Lambert)
 *  absorption coefficient for intensity per millimetre. */
export interface PaneMm {
  readonly thicknessMm: number;
  readonly refractiveIndex: number;
  readonly absorptionPerMm: number;
}

/** The model pane: 6 mm, n = 1.52, α = 0.02 /mm (one broadband α: a test fixture, not a real glass). */
export const PANE_6MM: PaneMm = { thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
/** Low-iron model pane: 4 mm, n = 1.52, α = 0.002 /mm. */
export const LOW_IRON_4MM: PaneMm = { thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.002 };
/** The 6 mm pane without absorption. */
export const LOSSLESS_6MM: PaneMm = { thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0 };
