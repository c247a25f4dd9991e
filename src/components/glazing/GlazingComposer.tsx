import { useEffect, useMemo, useRef, useState } from "react";
import { Controller, useFieldArray, useForm, useWatch, type FieldErrors, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { GlazingRequest, MAX_PANES, type Gap, type GlazingResponse, type MeasuredPane, type PhysicalPane } from "@/lib/contracts/glazing";
import { api, ApiError } from "@/lib/client/api";
import { PRESETS } from "@/lib/glazing-presets";
import AngularChart, { type Series } from "./AngularChart";
import GasField from "./GasField";
import { Field, FormMessage } from "@/components/forms/Field";
import LibraryBar, { type OpenMakeup } from "./LibraryBar";
import { readComposerDraft, writeComposerDraft } from "./draft";
import MakeupSection from "./MakeupSection";

type PhysicalIn = z.input<typeof PhysicalPane>;
type MeasuredIn = z.input<typeof MeasuredPane>;
type GapIn = z.input<typeof Gap>;
type LayerIn = PhysicalIn | MeasuredIn | GapIn;
interface FormValues {
  layers: LayerIn[];
}

const ANGLES = Array.from({ length: 91 }, (_, i) => i);
const PANE_COLORS = ["#7a3e9d", "#c2410c", "#0e7490", "#4d7c0f", "#9f1239", "#1d4ed8"];

const isGap = (l: LayerIn): l is GapIn => l.kind === "gap";
const isMeasured = (l: LayerIn): l is MeasuredIn => l.kind === "pane" && "measured" in l;

const physicalDefault = (thicknessMm = 4): PhysicalIn => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
const measuredDefault = (thicknessMm = 4): MeasuredIn => ({
  kind: "pane",
  thicknessMm,
  measured: { solarTransmittance: 0.8, solarReflectanceFront: 0.07, solarReflectanceBack: 0.07 },
});

const pct = (v: number | null | undefined, digits = 1) => (v == null ? "—" : `${(v * 100).toFixed(digits)} %`);
const fix = (v: number | null | undefined, digits = 3) => (v == null ? "—" : v.toFixed(digits));

function errorAt(errors: FieldErrors<FormValues>, path: string): { message?: string } | undefined {
  let cur: unknown = errors;
  for (const key of path.split(".")) {
    if (cur == null || typeof cur !== "object") return undefined;
    cur = (cur as Record<string, unknown>)[key];
  }
  return cur && typeof cur === "object" && "message" in cur ? (cur as { message?: string }) : undefined;
}

interface ComposerProps {
  /** The organisation whose library the composer saves to and opens from; none: no library bar. */
  library?: { organizationId: string; organizationName: string; canSave: boolean };
}

/** Compose a glazing make-up; its optics and thermal values update as you edit. */
export default function GlazingComposer({ library }: ComposerProps = {}) {
  const resolver = zodResolver(GlazingRequest as never) as unknown as Resolver<FormValues>;
  const { control, register, formState, reset, trigger } = useForm<FormValues>({
    resolver,
    mode: "onChange",
    defaultValues: { layers: PRESETS[2]!.request.layers as LayerIn[] },
  });
  const [openMakeup, setOpenMakeup] = useState<OpenMakeup | null>(null);
  const [selectedLayer, setSelectedLayer] = useState<number | null>(null);
  /** Selecting a layer on the drawing brings its fields into view and focuses the first one. */
  const selectLayer = (i: number) => {
    setSelectedLayer(i);
    const row = document.getElementById(`layer-${i}`);
    row?.scrollIntoView({ behavior: "smooth", block: "nearest" });
    row?.querySelector<HTMLElement>("input, select")?.focus({ preventScroll: true });
  };
  const restored = useRef(false);
  // After hydration: the draft of the last visit, if any (the server renders the default make-up).
  useEffect(() => {
    const d = readComposerDraft<LayerIn>();
    if (d) {
      reset({ layers: d.layers });
      // The draft lives in the browser only, so it can be restored only after hydration.
      // eslint-disable-next-line react-hooks/set-state-in-effect -- one restore after mount, not a render loop
      setOpenMakeup(d.open);
    }
    restored.current = true;
  }, [reset]);
  const layers = useFieldArray({ control, name: "layers" });
  const values = useWatch({ control }) as FormValues;
  const [result, setResult] = useState<GlazingResponse | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const seq = useRef(0);
  const errors = formState.errors;

  // Recalculate shortly after each valid edit; a newer edit supersedes an older request.
  const body = useMemo(() => JSON.stringify({ layers: values.layers, anglesDeg: ANGLES }), [values]);
  useEffect(() => {
    const parsed = GlazingRequest.safeParse(JSON.parse(body));
    if (!parsed.success) {
      void trigger();
      return;
    }
    const mine = ++seq.current;
    const t = setTimeout(async () => {
      setBusy(true);
      try {
        const res = await api<GlazingResponse>("POST", "/api/v1/calc/glazing", JSON.parse(body));
        if (mine === seq.current) {
          setResult(res);
          setFailure(null);
        }
      } catch (e) {
        if (mine === seq.current) setFailure(e instanceof ApiError ? e.message : String(e));
      } finally {
        if (mine === seq.current) setBusy(false);
      }
    }, 250);
    return () => clearTimeout(t);
  }, [body, trigger]);

  useEffect(() => {
    if (!restored.current || !values.layers?.length) return;
    writeComposerDraft({ layers: values.layers, open: openMakeup });
  }, [values, openMakeup]);
  const layersValid = GlazingRequest.safeParse({ layers: values.layers }).success;

  const paneCount = values.layers?.filter((l) => l && !isGap(l)).length ?? 0;
  const paneNumber = (layerIndex: number) => Math.floor(layerIndex / 2) + 1;

  const addPane = () => {
    layers.append({ kind: "gap", widthMm: 16, gas: "air" });
    layers.append(physicalDefault(4));
  };
  const removePane = (i: number) => {
    // Remove the pane and the gap on its indoor side (or outdoor side for the last pane).
    if (i === layers.fields.length - 1) layers.remove([i - 1, i]);
    else layers.remove([i, i + 1]);
  };

  const chart1: Series[] = result
    ? [
        { key: "T", label: "solar transmittance", color: "#0f4c5c", points: result.angles.map((a) => ({ x: a.angleDeg, y: a.solarTransmittance })) },
        { key: "g", label: "g-value", color: "#14212b", points: result.angles.map((a) => ({ x: a.angleDeg, y: a.gValue })) },
        {
          key: "Rf",
          label: "solar reflectance, outdoor side",
          color: "#e8a33d",
          points: result.angles.map((a) => ({ x: a.angleDeg, y: a.solarReflectanceFront })),
        },
        {
          key: "Rb",
          label: "solar reflectance, room side",
          color: "#e8a33d",
          dashed: true,
          points: result.angles.map((a) => ({ x: a.angleDeg, y: a.solarReflectanceBack })),
        },
        ...(result.angles[0]?.visibleTransmittance != null
          ? [
              {
                key: "Tv",
                label: "light transmittance",
                color: "#0f4c5c",
                dashed: true,
                points: result.angles.map((a) => ({ x: a.angleDeg, y: a.visibleTransmittance ?? 0 })),
              },
            ]
          : []),
      ]
    : [];
  const chart2: Series[] = result
    ? (result.angles[0]?.layerAbsorptance ?? []).map((_, k) => ({
        key: `A${k + 1}`,
        label: `pane ${k + 1}`,
        color: PANE_COLORS[k % PANE_COLORS.length]!,
        points: result.angles.map((a) => ({ x: a.angleDeg, y: a.layerAbsorptance[k] ?? 0 })),
      }))
    : [];
  const normal = result?.angles[0];

  return (
    <div className="space-y-6">
      {library && (
        <LibraryBar
          organizationId={library.organizationId}
          organizationName={library.organizationName}
          canSave={library.canSave}
          layers={values.layers ?? []}
          valid={layersValid}
          open={openMakeup}
          onOpen={(m) => {
            reset({ layers: structuredClone(m.layers) as LayerIn[] });
            setOpenMakeup({ id: m.id, revision: m.revision, name: m.name });
          }}
          onSaved={(m) => setOpenMakeup({ id: m.id, revision: m.revision, name: m.name })}
        />
      )}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,440px)_1fr]">
        <form method="post" className="space-y-4" noValidate onSubmit={(e) => e.preventDefault()} aria-label="Glazing make-up">
          <div>
            <label htmlFor="preset">Start from</label>
            <select
              id="preset"
              defaultValue=""
              onChange={(e) => {
                const p = PRESETS.find((x) => x.id === e.target.value);
                if (p) {
                  reset({ layers: structuredClone(p.request.layers) as LayerIn[] });
                  setOpenMakeup(null);
                }
              }}
            >
              <option value="" disabled>
                choose a typical make-up…
              </option>
              {PRESETS.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.label}
                </option>
              ))}
            </select>
          </div>
          <figure className="card space-y-2 p-3" aria-labelledby="section-caption">
            <div className="overflow-x-auto">
              <MakeupSection
                layers={values.layers ?? []}
                selected={selectedLayer}
                onSelect={selectLayer}
                title="The make-up in section: select a pane or a gap to edit it"
              />
            </div>
            <figcaption id="section-caption" className="text-xs text-slate">
              In section, to scale, outdoors on the left; sun-coloured lines are low-e coatings. Faces are numbered from outdoors (pane 1 has faces 1
              and 2, pane 2 faces 3 and 4, …). Select a pane or a gap to edit it below.
            </figcaption>
          </figure>
          <ol className="space-y-3">
            {layers.fields.map((field, i) => {
              const layer = values.layers?.[i];
              if (!layer) return null;
              const base = `layers.${i}`;
              if (isGap(layer)) {
                return (
                  <li
                    key={field.id}
                    id={`layer-${i}`}
                    className={`rounded border border-dashed bg-glass-light/40 p-3 ${selectedLayer === i ? "border-sun ring-2 ring-sun/40" : "border-glass/40"}`}
                    data-testid="gap-row"
                    onFocus={() => setSelectedLayer(i)}
                  >
                    <p className="mb-2 text-xs font-bold uppercase tracking-wide text-glass">Gap {paneNumber(i)}</p>
                    <div className="grid grid-cols-[110px_1fr] gap-3">
                      <Field label="Width (mm)" htmlFor={`${base}.widthMm`} error={errorAt(errors, `${base}.widthMm`)}>
                        <input
                          id={`${base}.widthMm`}
                          type="number"
                          step="any"
                          {...register(`layers.${i}.widthMm` as never, { valueAsNumber: true })}
                        />
                      </Field>
                      <Controller
                        control={control}
                        name={`layers.${i}.gas` as never}
                        render={({ field: f }) => <GasField id={base} value={f.value} onChange={f.onChange} />}
                      />
                    </div>
                    {errorAt(errors, `${base}.gas`)?.message && <p className="field-error">{errorAt(errors, `${base}.gas`)!.message}</p>}
                  </li>
                );
              }
              const n = paneNumber(i);
              const measured = isMeasured(layer);
              return (
                <li
                  key={field.id}
                  id={`layer-${i}`}
                  className={`card space-y-3 p-4 ${selectedLayer === i ? "ring-2 ring-sun/60" : ""}`}
                  data-testid="pane-row"
                  onFocus={() => setSelectedLayer(i)}
                >
                  <div className="flex items-center gap-2">
                    <p className="font-bold">
                      Pane {n}{" "}
                      <span className="text-xs font-normal text-slate">
                        faces {2 * n - 1} | {2 * n}
                      </span>
                    </p>
                    <select
                      aria-label={`How pane ${n} is described`}
                      className="ml-auto mt-0 w-auto py-1 text-sm"
                      value={measured ? "measured" : "physical"}
                      onChange={(e) => {
                        const t = layer.thicknessMm ?? 4;
                        const keep = { emissivityFront: layer.emissivityFront, emissivityBack: layer.emissivityBack };
                        layers.update(i, { ...(e.target.value === "measured" ? measuredDefault(t) : physicalDefault(t)), ...keep });
                      }}
                    >
                      <option value="physical">glass properties</option>
                      <option value="measured">measured values</option>
                    </select>
                    {paneCount > 1 && (
                      <button type="button" className="btn-quiet py-1" onClick={() => removePane(i)} aria-label={`Remove pane ${n}`}>
                        Remove
                      </button>
                    )}
                  </div>
                  <div className="grid grid-cols-3 gap-3">
                    <Field label="Thickness (mm)" htmlFor={`${base}.thicknessMm`} error={errorAt(errors, `${base}.thicknessMm`)}>
                      <input
                        id={`${base}.thicknessMm`}
                        type="number"
                        step="any"
                        {...register(`layers.${i}.thicknessMm` as never, { valueAsNumber: true })}
                      />
                    </Field>
                    {!measured && (
                      <>
                        <Field label="Refractive index" htmlFor={`${base}.refractiveIndex`} error={errorAt(errors, `${base}.refractiveIndex`)}>
                          <input
                            id={`${base}.refractiveIndex`}
                            type="number"
                            step="any"
                            {...register(`layers.${i}.refractiveIndex` as never, { valueAsNumber: true })}
                          />
                        </Field>
                        <Field label="Absorption (1/mm)" htmlFor={`${base}.absorptionPerMm`} error={errorAt(errors, `${base}.absorptionPerMm`)}>
                          <input
                            id={`${base}.absorptionPerMm`}
                            type="number"
                            step="any"
                            {...register(`layers.${i}.absorptionPerMm` as never, { valueAsNumber: true })}
                          />
                        </Field>
                      </>
                    )}
                  </div>
                  {measured && (
                    <div className="grid grid-cols-3 gap-3">
                      {(
                        [
                          ["solarTransmittance", "Solar T"],
                          ["solarReflectanceFront", "Solar R, face " + (2 * n - 1)],
                          ["solarReflectanceBack", "Solar R, face " + 2 * n],
                          ["visibleTransmittance", "Light T"],
                          ["visibleReflectanceFront", "Light R, face " + (2 * n - 1)],
                          ["visibleReflectanceBack", "Light R, face " + 2 * n],
                        ] as const
                      ).map(([key, label]) => (
                        <Field key={key} label={label} htmlFor={`${base}.measured.${key}`} error={errorAt(errors, `${base}.measured.${key}`)}>
                          <input
                            id={`${base}.measured.${key}`}
                            type="number"
                            step="any"
                            placeholder={key.startsWith("visible") ? "optional" : undefined}
                            {...register(`layers.${i}.measured.${key}` as never, {
                              setValueAs: (v: string) => (v === "" || v == null ? undefined : Number(v)),
                            })}
                          />
                        </Field>
                      ))}
                    </div>
                  )}
                  <div className="grid grid-cols-2 gap-3">
                    <Field
                      label={`Emissivity, face ${2 * n - 1}`}
                      htmlFor={`${base}.emissivityFront`}
                      error={errorAt(errors, `${base}.emissivityFront`)}
                      hint="0.837 if uncoated"
                    >
                      <input
                        id={`${base}.emissivityFront`}
                        type="number"
                        step="any"
                        placeholder="0.837"
                        {...register(`layers.${i}.emissivityFront` as never, {
                          setValueAs: (v: string) => (v === "" || v == null ? undefined : Number(v)),
                        })}
                      />
                    </Field>
                    <Field
                      label={`Emissivity, face ${2 * n}`}
                      htmlFor={`${base}.emissivityBack`}
                      error={errorAt(errors, `${base}.emissivityBack`)}
                      hint="0.837 if uncoated"
                    >
                      <input
                        id={`${base}.emissivityBack`}
                        type="number"
                        step="any"
                        placeholder="0.837"
                        {...register(`layers.${i}.emissivityBack` as never, {
                          setValueAs: (v: string) => (v === "" || v == null ? undefined : Number(v)),
                        })}
                      />
                    </Field>
                  </div>
                </li>
              );
            })}
          </ol>
          {errorAt(errors, "layers")?.message && <p className="field-error">{errorAt(errors, "layers")!.message}</p>}
          <button type="button" className="btn-quiet" onClick={addPane} disabled={paneCount >= MAX_PANES}>
            Add a gap and a pane (room side)
          </button>
        </form>

        <section className="space-y-5" aria-live="polite" data-testid="glazing-results" data-busy={busy ? "1" : "0"}>
          {failure && <FormMessage kind="error">{failure}</FormMessage>}
          {!result ? (
            <p className="text-slate">{busy ? "Calculating…" : "Enter a valid make-up to see its values."}</p>
          ) : (
            <>
              <div className="grid gap-4 sm:grid-cols-3">
                <div className="card">
                  <p className="text-xs font-bold uppercase tracking-wide text-slate">g-value (normal)</p>
                  <p className="text-3xl font-black tabular-nums" data-testid="g-normal">
                    {fix(normal?.gValue, 2)}
                  </p>
                  <p className="text-xs text-slate">EN 410 · hemispherical {fix(result.hemispherical.gValue, 2)}</p>
                </div>
                <div className="card">
                  <p className="text-xs font-bold uppercase tracking-wide text-slate">U-value, centre of glass</p>
                  <p className="text-3xl font-black tabular-nums" data-testid="u-value">
                    {result.uValue.toFixed(1)}
                  </p>
                  <p className="text-xs text-slate">W/(m²K) · EN 673 · unrounded {result.uValue.toFixed(3)}</p>
                </div>
                <div className="card">
                  <p className="text-xs font-bold uppercase tracking-wide text-slate">Light transmittance</p>
                  <p className="text-3xl font-black tabular-nums">
                    {normal?.visibleTransmittance == null ? "—" : pct(normal.visibleTransmittance, 0)}
                  </p>
                  <p className="text-xs text-slate">
                    {normal?.visibleTransmittance == null ? "needs measured light values for every pane" : "normal incidence"}
                  </p>
                </div>
              </div>
              <div className="card grid gap-6 2xl:grid-cols-2">
                <AngularChart title="Transmittance, reflectance and g" series={chart1} />
                <AngularChart title="Absorptance per pane (sun from outdoors)" series={chart2} />
              </div>
              <div className="card overflow-x-auto">
                <table className="w-full text-sm tabular-nums" data-testid="summary-table">
                  <thead className="text-left text-slate">
                    <tr>
                      <th className="py-1">Quantity</th>
                      <th className="text-right">Normal (0°)</th>
                      <th className="text-right">Hemispherical</th>
                    </tr>
                  </thead>
                  <tbody>
                    <tr className="border-t border-line">
                      <td className="py-1">Solar transmittance τe</td>
                      <td className="text-right">{fix(normal?.solarTransmittance)}</td>
                      <td className="text-right">{fix(result.hemispherical.solarTransmittance)}</td>
                    </tr>
                    <tr className="border-t border-line">
                      <td className="py-1">Solar reflectance ρe, outdoor side</td>
                      <td className="text-right">{fix(normal?.solarReflectanceFront)}</td>
                      <td className="text-right">{fix(result.hemispherical.solarReflectanceFront)}</td>
                    </tr>
                    <tr className="border-t border-line">
                      <td className="py-1">Solar reflectance, room side</td>
                      <td className="text-right">{fix(normal?.solarReflectanceBack)}</td>
                      <td className="text-right">{fix(result.hemispherical.solarReflectanceBack)}</td>
                    </tr>
                    {(normal?.layerAbsorptance ?? []).map((a, k) => (
                      <tr key={k} className="border-t border-line">
                        <td className="py-1">Absorptance, pane {k + 1}</td>
                        <td className="text-right">{fix(a)}</td>
                        <td className="text-right">{fix(result.hemispherical.layerAbsorptance[k])}</td>
                      </tr>
                    ))}
                    <tr className="border-t border-line font-bold">
                      <td className="py-1">g-value (total solar energy transmittance)</td>
                      <td className="text-right">{fix(normal?.gValue)}</td>
                      <td className="text-right">{fix(result.hemispherical.gValue)}</td>
                    </tr>
                    <tr className="border-t border-line">
                      <td className="py-1">Light transmittance τv</td>
                      <td className="text-right">{fix(normal?.visibleTransmittance)}</td>
                      <td className="text-right">{fix(result.hemispherical.visibleTransmittance)}</td>
                    </tr>
                  </tbody>
                </table>
              </div>
              <details className="card">
                <summary className="cursor-pointer font-bold">Values every 10°</summary>
                <table className="mt-3 w-full text-sm tabular-nums" data-testid="angle-table">
                  <thead className="text-left text-slate">
                    <tr>
                      <th>Angle</th>
                      <th className="text-right">τe</th>
                      <th className="text-right">ρe out</th>
                      <th className="text-right">ρe room</th>
                      {(normal?.layerAbsorptance ?? []).map((_, k) => (
                        <th key={k} className="text-right">
                          A{k + 1}
                        </th>
                      ))}
                      <th className="text-right">g</th>
                    </tr>
                  </thead>
                  <tbody>
                    {result.angles
                      .filter((a) => a.angleDeg % 10 === 0)
                      .map((a) => (
                        <tr key={a.angleDeg} className="border-t border-line">
                          <td>{a.angleDeg}°</td>
                          <td className="text-right">{fix(a.solarTransmittance)}</td>
                          <td className="text-right">{fix(a.solarReflectanceFront)}</td>
                          <td className="text-right">{fix(a.solarReflectanceBack)}</td>
                          {a.layerAbsorptance.map((x, k) => (
                            <td key={k} className="text-right">
                              {fix(x)}
                            </td>
                          ))}
                          <td className="text-right">{fix(a.gValue)}</td>
                        </tr>
                      ))}
                  </tbody>
                </table>
              </details>
              {result.warnings.length > 0 && (
                <ul className="notice list-disc space-y-1 pl-8" data-testid="warnings">
                  {result.warnings.map((w) => (
                    <li key={w}>{w}</li>
                  ))}
                </ul>
              )}
            </>
          )}
        </section>
      </div>
    </div>
  );
}
