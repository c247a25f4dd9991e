import { Controller, type Control, type UseFormRegister } from "react-hook-form";
import type { z } from "zod";
import type { Gap, MeasuredPane, PhysicalPane } from "@/lib/contracts/glazing";
import { Field } from "@/components/forms/Field";
import GasField from "./GasField";
import { layerName } from "./field-words";

export type PhysicalIn = z.input<typeof PhysicalPane>;
export type MeasuredIn = z.input<typeof MeasuredPane>;
export type GapIn = z.input<typeof Gap>;
export type LayerIn = PhysicalIn | MeasuredIn | GapIn;
export interface ComposerValues {
  layers: LayerIn[];
}

export const isGap = (l: LayerIn): l is GapIn => l.kind === "gap";
export const isMeasured = (l: LayerIn): l is MeasuredIn => l.kind === "pane" && "measured" in l;

export const physicalDefault = (thicknessMm = 4): PhysicalIn => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
export const measuredDefault = (thicknessMm = 4): MeasuredIn => ({
  kind: "pane",
  thicknessMm,
  measured: { solarTransmittance: 0.8, solarReflectanceFront: 0.07, solarReflectanceBack: 0.07 },
});

const optionalNumber = { setValueAs: (v: string) => (v === "" || v == null ? undefined : Number(v)) };

interface Props {
  index: number;
  layer: LayerIn;
  layerCount: number;
  paneCount: number;
  control: Control<ComposerValues>;
  register: UseFormRegister<ComposerValues>;
  /** The worded message at a path under `layers.<index>.`, e.g. "thicknessMm" or "measured.solarTransmittance". */
  errorAt: (path: string) => { message?: string } | undefined;
  onDescribe: (as: "physical" | "measured") => void;
  onRemove: () => void;
  onSelect: (index: number) => void;
}

/** The fields of the one layer selected on the section drawing, with steps to the layers on either side. */
export default function LayerInspector({
  index: i,
  layer,
  layerCount,
  paneCount,
  control,
  register,
  errorAt,
  onDescribe,
  onRemove,
  onSelect,
}: Props) {
  const base = `layers.${i}`;
  const num = (path: string, opts: object = { valueAsNumber: true }) => ({
    id: `${base}.${path}`,
    type: "number" as const,
    step: "any",
    ...register(`layers.${i}.${path}` as never, opts),
  });
  const n = Math.floor(i / 2) + 1;
  const steps = (
    <div className="flex items-center justify-between gap-2 border-t border-line pt-3 text-sm">
      <button type="button" className="btn-quiet py-1" disabled={i === 0} onClick={() => onSelect(i - 1)}>
        ← {i > 0 ? layerName(i - 1) : "outdoors"}
      </button>
      <button type="button" className="btn-quiet py-1" disabled={i === layerCount - 1} onClick={() => onSelect(i + 1)}>
        {i < layerCount - 1 ? layerName(i + 1) : "indoors"} →
      </button>
    </div>
  );

  if (isGap(layer)) {
    return (
      <section className="space-y-3" aria-labelledby="inspector-title" data-testid="gap-inspector" id={`layer-${i}`}>
        <h2 id="inspector-title" className="text-base">
          {layerName(i)}{" "}
          <span className="text-xs font-normal text-slate">
            between pane {n} and pane {n + 1}
          </span>
        </h2>
        <Field label="Width (mm)" htmlFor={`${base}.widthMm`} error={errorAt("widthMm")}>
          <input {...num("widthMm")} />
        </Field>
        <Controller
          control={control}
          name={`layers.${i}.gas` as never}
          render={({ field: f }) => <GasField id={base} value={f.value} onChange={f.onChange} />}
        />
        {errorAt("gas")?.message && <p className="field-error">{errorAt("gas")!.message}</p>}
        {steps}
      </section>
    );
  }

  const measured = isMeasured(layer);
  const front = 2 * n - 1;
  const back = 2 * n;
  return (
    <section className="space-y-3" aria-labelledby="inspector-title" data-testid="pane-inspector" id={`layer-${i}`}>
      <div className="flex items-start gap-2">
        <h2 id="inspector-title" className="text-base">
          {layerName(i)}{" "}
          <span className="text-xs font-normal text-slate">
            faces #{front} | #{back}
          </span>
        </h2>
        {paneCount > 1 && (
          <button type="button" className="btn-quiet ml-auto py-1 text-sm" onClick={onRemove} aria-label={`Remove pane ${n}`}>
            Remove
          </button>
        )}
      </div>
      <fieldset className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
        <legend className="mb-1 text-xs font-bold uppercase tracking-wide text-slate">How pane {n} is described</legend>
        {(
          [
            ["physical", "by its glass"],
            ["measured", "by data-sheet values"],
          ] as const
        ).map(([value, label]) => (
          <label key={value} className="mt-0 flex items-center gap-1.5 font-normal">
            <input
              type="radio"
              name={`${base}-described`}
              className="w-auto"
              checked={measured === (value === "measured")}
              onChange={() => onDescribe(value)}
            />
            {label}
          </label>
        ))}
      </fieldset>
      <div className="grid grid-cols-2 gap-3">
        <Field label="Thickness (mm)" htmlFor={`${base}.thicknessMm`} error={errorAt("thicknessMm")}>
          <input {...num("thicknessMm")} />
        </Field>
        {!measured && (
          <>
            <Field label="Refractive index" htmlFor={`${base}.refractiveIndex`} error={errorAt("refractiveIndex")} hint="1.52 for soda-lime glass">
              <input {...num("refractiveIndex")} />
            </Field>
            <Field
              label="Absorption (1/mm)"
              htmlFor={`${base}.absorptionPerMm`}
              error={errorAt("absorptionPerMm")}
              hint="about 0.01–0.03 for clear float"
            >
              <input {...num("absorptionPerMm")} />
            </Field>
          </>
        )}
      </div>
      {measured && (
        <div className="space-y-3">
          <p className="text-xs text-slate">Fractions 0–1 at normal incidence, from the maker's data sheet (EN 410).</p>
          <div className="grid grid-cols-3 gap-2">
            <Field label="Solar τe" htmlFor={`${base}.measured.solarTransmittance`} error={errorAt("measured.solarTransmittance")}>
              <input {...num("measured.solarTransmittance", optionalNumber)} />
            </Field>
            <Field label={`Solar ρe #${front}`} htmlFor={`${base}.measured.solarReflectanceFront`} error={errorAt("measured.solarReflectanceFront")}>
              <input {...num("measured.solarReflectanceFront", optionalNumber)} />
            </Field>
            <Field label={`Solar ρe #${back}`} htmlFor={`${base}.measured.solarReflectanceBack`} error={errorAt("measured.solarReflectanceBack")}>
              <input {...num("measured.solarReflectanceBack", optionalNumber)} />
            </Field>
            <Field label="Light τv" htmlFor={`${base}.measured.visibleTransmittance`} error={errorAt("measured.visibleTransmittance")}>
              <input {...num("measured.visibleTransmittance", optionalNumber)} placeholder="optional" />
            </Field>
            <Field
              label={`Light ρv #${front}`}
              htmlFor={`${base}.measured.visibleReflectanceFront`}
              error={errorAt("measured.visibleReflectanceFront")}
            >
              <input {...num("measured.visibleReflectanceFront", optionalNumber)} placeholder="optional" />
            </Field>
            <Field label={`Light ρv #${back}`} htmlFor={`${base}.measured.visibleReflectanceBack`} error={errorAt("measured.visibleReflectanceBack")}>
              <input {...num("measured.visibleReflectanceBack", optionalNumber)} placeholder="optional" />
            </Field>
          </div>
          <p className="text-xs text-slate">Light values: τv alone is enough when the data sheet gives no light reflectance.</p>
        </div>
      )}
      <div className="grid grid-cols-2 gap-3">
        <Field label={`Emissivity #${front}`} htmlFor={`${base}.emissivityFront`} error={errorAt("emissivityFront")} hint="0.837 if uncoated">
          <input {...num("emissivityFront", optionalNumber)} placeholder="0.837" />
        </Field>
        <Field label={`Emissivity #${back}`} htmlFor={`${base}.emissivityBack`} error={errorAt("emissivityBack")} hint="0.837 if uncoated">
          <input {...num("emissivityBack", optionalNumber)} placeholder="0.837" />
        </Field>
      </div>
      {steps}
    </section>
  );
}
