import { useEffect, useMemo, useRef, useState } from "react";
import { useFieldArray, useForm, useWatch, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { GlazingRequest, MAX_PANES, type GlazingResponse } from "@/lib/contracts/glazing";
import { api, ApiError } from "@/lib/client/api";
import { PRESETS } from "@/lib/glazing-presets";
import AngularChart, { type Series } from "./AngularChart";
import { FormMessage } from "@/components/forms/Field";
import { makeupDescription } from "@/lib/calc/makeup-description";
import AngleReadout, { anglesCsv } from "./AngleReadout";
import { glazingMessageInWords, layerName } from "./field-words";
import LayerInspector, { isGap, measuredDefault, physicalDefault, type ComposerValues, type LayerIn, type PhysicalIn } from "./LayerInspector";
import SunBudget, { PANE_COLORS } from "./SunBudget";
import LibraryBar, { type OpenMakeup } from "./LibraryBar";
import { readComposerDraft, writeComposerDraft } from "./draft";
import MakeupSection from "./MakeupSection";
import { useWidth } from "@/components/charts/useWidth";

type FormValues = ComposerValues;

const ANGLES = Array.from({ length: 91 }, (_, i) => i);

const fix = (v: number | null | undefined, digits = 3) => (v == null ? "—" : v.toFixed(digits));

interface ComposerProps {
  /** The organisation whose library the composer saves to and opens from; none: no library bar. */
  library?: { organizationId: string; organizationName: string; canSave: boolean };
}

/** Compose a glazing make-up; its optics and thermal values update as you edit. */
export default function GlazingComposer({ library }: ComposerProps = {}) {
  const resolver = zodResolver(GlazingRequest as never) as unknown as Resolver<FormValues>;
  const { control, register, reset } = useForm<FormValues>({
    resolver,
    mode: "onChange",
    defaultValues: { layers: PRESETS[2]!.request.layers as LayerIn[] },
  });
  const [openMakeup, setOpenMakeup] = useState<OpenMakeup | null>(null);
  const [selectedLayer, setSelectedLayer] = useState(0);
  const [angle, setAngle] = useState(0);
  const [drawingRef, drawingWidth] = useWidth<HTMLDivElement>(520);
  /** Selecting a layer on the drawing opens it in the inspector beside the drawing and focuses its first field. */
  const selectLayer = (i: number) => {
    setSelectedLayer(i);
    requestAnimationFrame(() => {
      const panel = document.getElementById(`layer-${i}`);
      panel?.scrollIntoView({ behavior: "smooth", block: "nearest" });
      panel?.querySelector<HTMLElement>("input:not([type=radio]), select")?.focus({ preventScroll: true });
    });
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

  // Recalculate shortly after each valid edit; a newer edit supersedes an older request.
  const body = useMemo(() => JSON.stringify({ layers: values.layers, anglesDeg: ANGLES }), [values]);
  useEffect(() => {
    if (!GlazingRequest.safeParse(JSON.parse(body)).success) return;
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
  }, [body]);

  useEffect(() => {
    if (!restored.current || !values.layers?.length) return;
    writeComposerDraft({ layers: values.layers, open: openMakeup });
  }, [values, openMakeup]);

  const parsed = useMemo(() => GlazingRequest.safeParse({ layers: values.layers }), [values]);
  const layersValid = parsed.success;
  /** Every problem of the make-up, worded, by layer: the same schema as the endpoint's, read from what is on screen. */
  const problems = useMemo(() => {
    const out: { layer: number | null; path: string; message: string }[] = [];
    if (parsed.success) return out;
    for (const issue of parsed.error.issues) {
      const [head, layer, ...rest] = issue.path as (string | number)[];
      if (head === "layers" && typeof layer === "number") out.push({ layer, path: rest.join("."), message: glazingMessageInWords(issue.message) });
      else out.push({ layer: null, path: "", message: glazingMessageInWords(issue.message) });
    }
    return out;
  }, [parsed]);
  const invalidLayers = [...new Set(problems.flatMap((p) => (p.layer === null ? [] : [p.layer])))];

  const paneCount = values.layers?.filter((l) => l && !isGap(l)).length ?? 0;
  const layerCount = values.layers?.length ?? 0;
  const current = Math.min(selectedLayer, Math.max(0, layerCount - 1));
  const currentLayer = values.layers?.[current];

  const addPaneIndoors = () => {
    layers.append([{ kind: "gap", widthMm: 16, gas: "air" }, physicalDefault(4)]);
    setSelectedLayer(layerCount + 1);
  };
  const addPaneOutdoors = () => {
    layers.prepend([physicalDefault(4), { kind: "gap", widthMm: 16, gas: "air" }]);
    setSelectedLayer(0);
  };
  const removePane = (i: number) => {
    // Remove the pane and the gap on its indoor side (or outdoor side for the last pane).
    if (i === layers.fields.length - 1) layers.remove([i - 1, i]);
    else layers.remove([i, i + 1]);
    setSelectedLayer(Math.max(0, i - 2));
  };

  const at = result?.angles.find((a) => a.angleDeg === angle) ?? result?.angles[0];
  const hasLight = result?.angles.some((a) => a.visibleTransmittance != null) ?? false;
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
        ...(hasLight
          ? [
              {
                key: "Tv",
                label: "light transmittance",
                color: "#0f4c5c",
                dashed: true,
                points: result.angles.flatMap((a) => (a.visibleTransmittance == null ? [] : [{ x: a.angleDeg, y: a.visibleTransmittance }])),
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
  const light = result?.light;

  const downloadCsv = () => {
    if (!result) return;
    const url = URL.createObjectURL(new Blob([anglesCsv(result)], { type: "text/csv" }));
    const a = document.createElement("a");
    a.href = url;
    a.download = `${(openMakeup?.name ?? "make-up").replace(/[^\w.-]+/g, "-")}-angles.csv`;
    a.click();
    URL.revokeObjectURL(url);
  };

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
            setSelectedLayer(0);
          }}
          onSaved={(m) => setOpenMakeup({ id: m.id, revision: m.revision, name: m.name })}
        />
      )}
      <form method="post" noValidate onSubmit={(e) => e.preventDefault()} aria-label="Glazing make-up" className="card space-y-4 p-0">
        <div className="flex flex-wrap items-end gap-3 border-b border-line px-4 py-3">
          <div className="min-w-0 flex-1">
            <p className="text-xs font-bold uppercase tracking-wide text-slate">In section</p>
            <p className="truncate font-bold" data-testid="composer-description">
              {parsed.success ? makeupDescription(parsed.data.layers) : "incomplete make-up"}
            </p>
          </div>
          <div className="w-full sm:w-64">
            <label htmlFor="preset">Start from</label>
            <select
              id="preset"
              defaultValue=""
              onChange={(e) => {
                const p = PRESETS.find((x) => x.id === e.target.value);
                if (p) {
                  reset({ layers: structuredClone(p.request.layers) as LayerIn[] });
                  setOpenMakeup(null);
                  setSelectedLayer(0);
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
        </div>
        <div className="grid gap-4 px-4 pb-4 lg:grid-cols-[minmax(0,1fr)_minmax(300px,380px)]">
          <figure className="min-w-0 space-y-3" aria-labelledby="section-caption">
            <div className="flex flex-wrap gap-2 text-sm">
              <button type="button" className="btn-quiet py-1" onClick={addPaneOutdoors} disabled={paneCount >= MAX_PANES}>
                + pane outdoors
              </button>
              <button type="button" className="btn-quiet py-1" onClick={addPaneIndoors} disabled={paneCount >= MAX_PANES}>
                + pane on the room side
              </button>
              <span className="self-center text-xs text-slate">
                {paneCount} of at most {MAX_PANES} panes
              </span>
            </div>
            <div className="relative overflow-x-auto rounded border border-line bg-paper/60 p-2" ref={drawingRef}>
              <MakeupSection
                fitWidth={drawingWidth - 20}
                layers={values.layers ?? []}
                selected={current}
                invalid={invalidLayers}
                onSelect={selectLayer}
                height={230}
                title="The make-up in section: select a pane or a gap to edit it"
              />
            </div>
            <figcaption id="section-caption" className="text-xs text-slate">
              To scale, outdoors on the left; sun-coloured lines are low-e coatings, red outlines layers that need a correction. Faces are numbered
              from outdoors (pane 1 has faces #1 and #2, pane 2 faces #3 and #4, …). Select a pane or a gap to edit it beside the drawing.
            </figcaption>
            {result && normal && (
              <dl className="grid grid-cols-3 gap-3 border-t border-line pt-3" data-testid="readings">
                <div>
                  <dt className="text-xs text-slate">g-value, normal · EN 410</dt>
                  <dd className="text-2xl font-black tabular-nums" data-testid="g-normal">
                    {fix(normal.gValue, 2)}
                  </dd>
                  <dd className="text-xs text-slate">hemispherical {fix(result.hemispherical.gValue, 2)}</dd>
                </div>
                <div>
                  <dt className="text-xs text-slate">U-value · EN 673</dt>
                  <dd className="text-2xl font-black tabular-nums" data-testid="u-value">
                    {result.uValue.toFixed(1)}
                  </dd>
                  <dd className="text-xs text-slate">W/(m²K), centre of glass · {result.uValue.toFixed(3)}</dd>
                </div>
                <div>
                  <dt className="text-xs text-slate">Light τv, normal</dt>
                  <dd className="text-2xl font-black tabular-nums" data-testid="light-normal">
                    {lightText(light)}
                  </dd>
                  <dd className="text-xs text-slate">{lightNote(light)}</dd>
                </div>
              </dl>
            )}
          </figure>
          <aside className="rounded border border-glass/30 bg-glass-light/30 p-4" aria-label="Selected layer">
            {problems.some((p) => p.layer !== current) && (
              <div className="mb-3 rounded border border-alert/30 bg-alert/5 p-2 text-sm" role="alert" data-testid="other-problems">
                <p className="font-bold text-alert">Also to correct</p>
                <ul className="space-y-0.5">
                  {problems
                    .filter((p) => p.layer !== current)
                    .map((p, k) => (
                      <li key={k}>
                        {p.layer === null ? (
                          p.message
                        ) : (
                          <button type="button" className="text-left underline" onClick={() => selectLayer(p.layer!)}>
                            {layerName(p.layer)}: {p.message}
                          </button>
                        )}
                      </li>
                    ))}
                </ul>
              </div>
            )}
            {currentLayer && (
              <LayerInspector
                key={layers.fields[current]?.id ?? current}
                index={current}
                layer={currentLayer}
                layerCount={layerCount}
                paneCount={paneCount}
                control={control}
                register={register}
                errorAt={(path) => {
                  const p = problems.find((x) => x.layer === current && x.path === path);
                  return p ? { message: p.message } : undefined;
                }}
                onDescribe={(as) => {
                  const pane = currentLayer as PhysicalIn;
                  const t = pane.thicknessMm ?? 4;
                  const keep = { emissivityFront: pane.emissivityFront, emissivityBack: pane.emissivityBack };
                  layers.update(current, { ...(as === "measured" ? measuredDefault(t) : physicalDefault(t)), ...keep });
                }}
                onRemove={() => removePane(current)}
                onSelect={selectLayer}
              />
            )}
          </aside>
        </div>
      </form>

      <section className="space-y-5" aria-live="polite" data-testid="glazing-results" data-busy={busy ? "1" : "0"}>
        {failure && <FormMessage kind="error">{failure}</FormMessage>}
        {!result || !at ? (
          <p className="text-slate">{busy ? "Calculating…" : "Enter a valid make-up to see its values."}</p>
        ) : (
          <>
            {result.warnings.length > 0 && (
              <ul className="notice list-disc space-y-1 pl-8" data-testid="warnings">
                {result.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            )}
            <div className="card space-y-4">
              <div className="flex flex-wrap items-end gap-4">
                <div className="min-w-0 flex-1">
                  <label htmlFor="angle">Angle of incidence: {angle}° from the normal</label>
                  <input
                    id="angle"
                    type="range"
                    min={0}
                    max={90}
                    step={1}
                    value={angle}
                    onChange={(e) => setAngle(Number(e.target.value))}
                    className="w-full accent-[#e8a33d]"
                  />
                </div>
                <button type="button" className="btn-quiet" onClick={downloadCsv}>
                  Every angle as CSV
                </button>
              </div>
              <SunBudget values={at} caption={`Where the sun goes at ${angle}°: shares of the sun striking pane 1`} />
              <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
                <AngleReadout result={result} angleDeg={angle} />
                <div className="min-w-0 space-y-6">
                  <AngularChart title="Transmittance, reflectance and g" series={chart1} marker={angle} />
                  <AngularChart title="Absorptance per pane (sun from outdoors)" series={chart2} marker={angle} />
                </div>
              </div>
            </div>
          </>
        )}
      </section>
    </div>
  );
}

/** The make-up's light transmittance at normal incidence: exact, a range, or unknown. */
function lightText(light: GlazingResponse["light"] | undefined): string {
  if (!light) return "—";
  if (light.transmittance !== null) return light.transmittance.toFixed(2);
  if (light.range) return `${light.range.low.toFixed(2)}–${light.range.high.toFixed(2)}`;
  return "—";
}

function lightNote(light: GlazingResponse["light"] | undefined): string {
  if (!light || light.basis === "not given") return "needs each pane's light transmittance (data-sheet values)";
  if (light.basis === "transmittance only")
    return light.transmittance !== null ? "light reflectance unknown" : "range: light reflectance of some panes unknown";
  return "normal incidence";
}
