import type { GlazingResponse, GlazingValues } from "@/lib/contracts/glazing";

const fix = (v: number | null | undefined, digits = 3) => (v == null ? "—" : v.toFixed(digits));

/** Every angle's values as CSV (one row a degree), for the consultant's own spreadsheet. */
export function anglesCsv(result: GlazingResponse): string {
  const panes = result.angles[0]?.layerAbsorptance.length ?? 0;
  const head = [
    "angle_deg",
    "solar_transmittance",
    "solar_reflectance_outdoor_side",
    "solar_reflectance_room_side",
    ...Array.from({ length: panes }, (_, k) => `absorptance_pane_${k + 1}`),
    "g_value",
    "light_transmittance",
  ];
  const row = (label: string, v: GlazingValues) =>
    [label, v.solarTransmittance, v.solarReflectanceFront, v.solarReflectanceBack, ...v.layerAbsorptance, v.gValue, v.visibleTransmittance ?? ""]
      .map((x) => (typeof x === "number" ? x.toFixed(6) : x))
      .join(",");
  return [head.join(","), ...result.angles.map((a) => row(String(a.angleDeg), a)), row("hemispherical", result.hemispherical)].join("\n") + "\n";
}

interface Props {
  result: GlazingResponse;
  angleDeg: number;
}

/** The values at the chosen angle beside the hemispherical ones (diffuse light), one row a quantity. */
export default function AngleReadout({ result, angleDeg }: Props) {
  const at = result.angles.find((a) => a.angleDeg === angleDeg) ?? result.angles[0]!;
  const h = result.hemispherical;
  const rows: [string, number | null, number | null, boolean?][] = [
    ["Solar transmittance τe", at.solarTransmittance, h.solarTransmittance],
    ["Solar reflectance ρe, outdoor side", at.solarReflectanceFront, h.solarReflectanceFront],
    ["Solar reflectance, room side", at.solarReflectanceBack, h.solarReflectanceBack],
    ...at.layerAbsorptance.map((a, k): [string, number, number | null] => [`Absorptance, pane ${k + 1}`, a, h.layerAbsorptance[k] ?? null]),
    ["g-value (total solar energy transmittance)", at.gValue, h.gValue, true],
    ["Light transmittance τv", at.visibleTransmittance, h.visibleTransmittance],
  ];
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full text-sm tabular-nums" data-testid="summary-table">
        <thead className="text-left text-slate">
          <tr>
            <th className="py-1">Quantity</th>
            <th className="text-right" data-testid="readout-angle">
              at {at.angleDeg}°
            </th>
            <th className="pl-3 text-right">Hemispherical</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, a, hv, strong]) => (
            <tr key={label} className={`border-t border-line ${strong ? "font-bold" : ""}`}>
              <td className="py-1 pr-2">{label}</td>
              <td className="text-right">{fix(a)}</td>
              <td className="pl-3 text-right">{fix(hv)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
