import { useEffect, useMemo, useRef, useState } from "react";
import { useFieldArray, useForm, useWatch, type FieldErrors, type UseFormRegister, type UseFormSetValue } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { ProjectCreateRequest, SKY_MODEL_LABELS, SKY_MODELS } from "@/lib/contracts/projects";
import { api, ApiError } from "@/lib/client/api";
import { compassPoint } from "@/lib/format";
import { applyServerErrors, Field, FormMessage } from "./forms/Field";
import { useHydrated } from "./forms/useHydrated";
import FacadePlan from "./FacadePlan";

type Input = z.input<typeof ProjectCreateRequest>;
type Output = z.output<typeof ProjectCreateRequest>;

interface Props {
  organizations: { id: string; name: string }[];
  defaultOrganizationId: string;
  /** Edit mode: the project as stored, with its façades. */
  project?: Omit<Input, "organizationId"> & { id: string };
  /** Edit mode: glazing options per façade id (absent = none); removing such a façade asks first. */
  optionCounts?: Record<string, number>;
}

const FIELDS = [
  "name",
  "reference",
  "buildingName",
  "siteName",
  "latitudeDeg",
  "longitudeDeg",
  "timeZone",
  "elevationM",
  "groundAlbedo",
  "skyModel",
  "linkeTurbidity",
  "description",
] as const;

/** An empty number field is "not given" (the schema reads null as absent). */
const numberOrNull = (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v));
/** "2.5, 3, …" as twelve numbers; empty = the engine's monthly defaults; anything else is left for the schema to refuse. */
const monthlyValues = (v: unknown) => {
  if (Array.isArray(v)) return v;
  const text = String(v ?? "").trim();
  if (!text) return null;
  return text.split(/[\s,;]+/).map((x) => Number(x.replace(",", ".")));
};

/** An empty number field of a shading device: absent (an optional value) or left for the schema to name (a required one). */
const numberOrAbsent = (v: unknown) => (v === "" || v === null || v === undefined ? undefined : Number(v));

/** The server's names of a façade's shading fields, as the form registers them. */
const SHADING_PATHS = [
  "shading.overhang.depthM",
  "shading.overhang.gapAboveM",
  "shading.overhang.extensionLeftM",
  "shading.overhang.extensionRightM",
  "shading.fins.depthM",
  "shading.fins.gapM",
  "shading.horizonDeg",
] as const;

/** The schema's field keys as the form labels them (the endpoint's messages start with the key). */
const FIELD_WORDS: Record<string, string> = {
  organizationId: "Organisation",
  name: "Name",
  reference: "Job number",
  buildingName: "Building",
  description: "Description",
  siteName: "Site name",
  latitudeDeg: "Latitude (°)",
  longitudeDeg: "Longitude (°)",
  elevationM: "Elevation (m)",
  timeZone: "Time zone",
  azimuthDeg: "Azimuth (°)",
  tiltDeg: "Tilt (°)",
  windowWidthM: "Window width (m)",
  windowHeightM: "Window height (m)",
};

/** A message in words: "Latitude (°) must be between -90 and 90"; a façade's starts with its row, "Façade 3: name is required". */
function worded(error: { message?: string } | undefined, row?: number): { message?: string } | undefined {
  if (!error?.message) return undefined;
  const m = error.message.replace(/^([A-Za-z]+)\b/, (key) => FIELD_WORDS[key] ?? key).replace(/\bgive the window's/, "Give the window's");
  return { message: row === undefined ? m : `Façade ${row + 1}: ${m.charAt(0).toLowerCase()}${m.slice(1)}` };
}

/** A shading field's message in its row: "Façade 2: overhang depth (m) must be …". */
const inRow = (i: number, error: { message?: string } | undefined) =>
  error?.message ? { message: `Façade ${i + 1}: ${error.message.charAt(0).toLowerCase()}${error.message.slice(1)}` } : undefined;

/** Every message under an error object (the devices of a façade whose window is not given are hidden). */
function messagesOf(error: unknown): string[] {
  if (!error || typeof error !== "object") return [];
  const e = error as { message?: unknown };
  if (typeof e.message === "string") return [e.message];
  return Object.entries(error).flatMap(([k, v]) => (k === "ref" ? [] : messagesOf(v)));
}

const isSize = (v: unknown) => typeof v === "number" && Number.isFinite(v) && v > 0;

type Facade = NonNullable<Input["facades"]>[number];

/** The overhang, fins and horizon of one façade, around its typical window. */
function ShadingDevices({
  i,
  facade,
  register,
  setValue,
  errors,
}: {
  i: number;
  facade: Facade | undefined;
  register: UseFormRegister<Input>;
  setValue: UseFormSetValue<Input>;
  errors: FieldErrors<Input>;
}) {
  const shading = facade?.shading ?? {};
  const hasWindow = isSize(facade?.windowWidthM) && isSize(facade?.windowHeightM);
  const e = errors.facades?.[i]?.shading;
  const id = (path: string) => `facades.${i}.shading.${path}`;
  const toggle = (device: "overhang" | "fins" | "horizonDeg", on: boolean) => {
    const start = { overhang: { depthM: undefined, gapAboveM: 0 }, fins: { depthM: undefined, gapM: 0 }, horizonDeg: undefined }[device];
    // A device switched off is absent from what is sent, not an empty object.
    const { [device]: _old, ...others } = shading;
    setValue(`facades.${i}.shading`, (on ? { ...others, [device]: start } : others) as never, { shouldDirty: true });
  };
  const has = { overhang: shading.overhang != null, fins: shading.fins != null, horizonDeg: "horizonDeg" in shading };
  const saved = [has.overhang && "an overhang", has.fins && "side fins", shading.horizonDeg != null && "a horizon angle"].filter(Boolean);
  const number = (path: (typeof SHADING_PATHS)[number]) =>
    register(`facades.${i}.${path}` as `facades.${number}.shading.horizonDeg`, { setValueAs: numberOrAbsent });

  return (
    <fieldset className="col-span-full min-w-0 rounded border border-line px-3 pb-3" data-testid="shading-devices">
      <legend className="px-1 text-sm font-bold text-slate">Shading devices</legend>
      {!hasWindow ? (
        <div className="text-xs text-slate" data-testid="shading-needs-window">
          <p>
            Shading devices count only once the façade has a typical window (width and height): give both above to add an overhang, fins or a horizon
            angle.
          </p>
          {saved.length > 0 && <p className="mt-1">The saved {saved.join(", ")} stay with the façade and count again once the window is given.</p>}
          {messagesOf(e).map((m) => (
            <p key={m} className="field-error" role="alert">
              {inRow(i, { message: m })!.message}
            </p>
          ))}
        </div>
      ) : (
        <div className="space-y-3">
          <div className="flex flex-wrap gap-x-5 gap-y-1">
            {(
              [
                ["overhang", "Overhang above"],
                ["fins", "Side fins"],
                ["horizonDeg", "Horizon obstruction"],
              ] as const
            ).map(([device, label]) => (
              <label key={device} className="flex items-center gap-2 font-normal text-ink">
                <input type="checkbox" className="mt-0 w-auto" checked={has[device]} onChange={(ev) => toggle(device, ev.target.checked)} />
                {label}
              </label>
            ))}
          </div>
          {has.overhang && (
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
              <Field label="Overhang depth m" htmlFor={id("overhang.depthM")} error={inRow(i, e?.overhang?.depthM)}>
                <input id={id("overhang.depthM")} type="number" step="any" min="0" {...number("shading.overhang.depthM")} />
              </Field>
              <Field label="Gap above window m" htmlFor={id("overhang.gapAboveM")} error={inRow(i, e?.overhang?.gapAboveM)}>
                <input id={id("overhang.gapAboveM")} type="number" step="any" min="0" {...number("shading.overhang.gapAboveM")} />
              </Field>
              <Field label="Runs past left m" htmlFor={id("overhang.extensionLeftM")} error={inRow(i, e?.overhang?.extensionLeftM)}>
                <input
                  id={id("overhang.extensionLeftM")}
                  type="number"
                  step="any"
                  min="0"
                  placeholder="very long"
                  {...number("shading.overhang.extensionLeftM")}
                />
              </Field>
              <Field label="Runs past right m" htmlFor={id("overhang.extensionRightM")} error={inRow(i, e?.overhang?.extensionRightM)}>
                <input
                  id={id("overhang.extensionRightM")}
                  type="number"
                  step="any"
                  min="0"
                  placeholder="very long"
                  {...number("shading.overhang.extensionRightM")}
                />
              </Field>
              <p className="col-span-full text-xs text-slate">
                How far the overhang runs past each side of the window; leave empty for one that runs far past both sides.
              </p>
            </div>
          )}
          {has.fins && (
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
              <Field label="Fin depth m" htmlFor={id("fins.depthM")} error={inRow(i, e?.fins?.depthM)}>
                <input id={id("fins.depthM")} type="number" step="any" min="0" {...number("shading.fins.depthM")} />
              </Field>
              <Field label="Gap from window edge m" htmlFor={id("fins.gapM")} error={inRow(i, e?.fins?.gapM)}>
                <input id={id("fins.gapM")} type="number" step="any" min="0" {...number("shading.fins.gapM")} />
              </Field>
              <p className="col-span-2 self-center text-xs text-slate">One fin on each side of the window, as tall as the window.</p>
            </div>
          )}
          {has.horizonDeg && (
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
              <Field label="Horizon angle °" htmlFor={id("horizonDeg")} error={inRow(i, e?.horizonDeg)}>
                <input id={id("horizonDeg")} type="number" step="any" min="0" max="89" {...number("shading.horizonDeg")} />
              </Field>
              <p className="col-span-1 self-center text-xs text-slate sm:col-span-3">
                Buildings or terrain in front of the window, in degrees above the horizontal.
              </p>
            </div>
          )}
        </div>
      )}
    </fieldset>
  );
}

export default function ProjectForm({ organizations, defaultOrganizationId, project, optionCounts = {} }: Props) {
  const hydrated = useHydrated();
  const [failure, setFailure] = useState<string | null>(null);
  const zones = useMemo(() => (typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : []), []);
  const { register, handleSubmit, control, formState, setError, setValue } = useForm<Input, unknown, Output>({
    resolver: zodResolver(ProjectCreateRequest),
    defaultValues: project
      ? { organizationId: defaultOrganizationId, ...project }
      : {
          organizationId: defaultOrganizationId,
          name: "",
          reference: "",
          buildingName: "",
          siteName: "",
          timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone,
          elevationM: 0,
          groundAlbedo: 0.2,
          skyModel: "perez",
          linkeTurbidity: null,
          description: "",
          facades: [
            { name: "North", azimuthDeg: 0, tiltDeg: 90 },
            { name: "East", azimuthDeg: 90, tiltDeg: 90 },
            { name: "South", azimuthDeg: 180, tiltDeg: 90 },
            { name: "West", azimuthDeg: 270, tiltDeg: 90 },
          ],
        },
  });
  const facades = useFieldArray({ control, name: "facades" });
  const watchedFacades = useWatch({ control, name: "facades" }) ?? [];
  const errors = formState.errors;
  /** The row (by its field key) whose removal waits for the consultant's yes, because options go with it. */
  const [confirming, setConfirming] = useState<string | null>(null);
  const keepButton = useRef<HTMLButtonElement>(null);
  const addButton = useRef<HTMLButtonElement>(null);
  /** The rows' Remove buttons by field key (the keys differ between the server's markup and the browser's). */
  const removeButtons = useRef(new Map<string, HTMLButtonElement>());
  /** Where the focus goes once the question is answered: the row's Remove button, or Add a façade. */
  const focusAfter = useRef<HTMLElement | null>(null);
  useEffect(() => {
    if (confirming) keepButton.current?.focus();
    else if (focusAfter.current) {
      focusAfter.current.focus();
      focusAfter.current = null;
    }
  }, [confirming]);
  const optionsOf = (i: number) => {
    const id = watchedFacades[i]?.id;
    return id ? (optionCounts[id] ?? 0) : 0;
  };
  const removeRow = (i: number) => {
    facades.remove(i);
    if (confirming) {
      focusAfter.current = addButton.current;
      setConfirming(null);
    } else addButton.current?.focus();
  };
  const keepRow = (key: string) => {
    focusAfter.current = removeButtons.current.get(key) ?? null;
    setConfirming(null);
  };

  const onSubmit = handleSubmit(async (v) => {
    setFailure(null);
    try {
      if (project) {
        const { organizationId: _org, ...changes } = v;
        await api("PATCH", `/api/v1/projects/${project.id}`, changes);
        window.location.assign(`/projects/${project.id}`);
      } else {
        const res = await api<{ project: { id: string } }>("POST", "/api/v1/projects", v);
        window.location.assign(`/projects/${res.project.id}`);
      }
    } catch (e) {
      const err = e instanceof ApiError ? e : new ApiError(0, String(e));
      const facadeFields = (v.facades ?? []).flatMap((_, i) => SHADING_PATHS.map((p) => `facades.${i}.${p}`));
      applyServerErrors(err.errors, [...FIELDS, ...facadeFields], setError);
      setFailure(err.message);
    }
  });

  return (
    <form method="post" onSubmit={onSubmit} className="space-y-6" noValidate>
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <fieldset className="card grid gap-4 md:grid-cols-2">
        <legend className="px-1 font-bold">Project</legend>
        {!project && organizations.length > 1 && (
          <Field label="Organisation" htmlFor="organizationId" error={worded(errors.organizationId)}>
            <select id="organizationId" {...register("organizationId")}>
              {organizations.map((o) => (
                <option key={o.id} value={o.id}>
                  {o.name}
                </option>
              ))}
            </select>
          </Field>
        )}
        <Field label="Project name" htmlFor="name" error={worded(errors.name)}>
          <input id="name" {...register("name")} />
        </Field>
        <Field label="Job number" htmlFor="reference" error={worded(errors.reference)} hint="Your firm's reference, optional.">
          <input id="reference" {...register("reference")} />
        </Field>
        <Field label="Building" htmlFor="buildingName" error={worded(errors.buildingName)}>
          <input id="buildingName" {...register("buildingName")} />
        </Field>
        <div className="md:col-span-2">
          <Field label="Description" htmlFor="description" error={worded(errors.description)}>
            <textarea id="description" rows={3} {...register("description")} />
          </Field>
        </div>
      </fieldset>

      <fieldset className="card grid gap-4 md:grid-cols-3">
        <legend className="px-1 font-bold">Site</legend>
        <div className="md:col-span-3">
          <Field label="Site name" htmlFor="siteName" error={worded(errors.siteName)}>
            <input id="siteName" {...register("siteName")} />
          </Field>
        </div>
        <Field label="Latitude (°, north +)" htmlFor="latitudeDeg" error={worded(errors.latitudeDeg)}>
          <input id="latitudeDeg" type="number" step="any" {...register("latitudeDeg", { valueAsNumber: true })} />
        </Field>
        <Field label="Longitude (°, east +)" htmlFor="longitudeDeg" error={worded(errors.longitudeDeg)}>
          <input id="longitudeDeg" type="number" step="any" {...register("longitudeDeg", { valueAsNumber: true })} />
        </Field>
        <Field label="Elevation (m)" htmlFor="elevationM" error={worded(errors.elevationM)}>
          <input id="elevationM" type="number" step="any" {...register("elevationM", { valueAsNumber: true })} />
        </Field>
        <Field
          label="Ground albedo"
          htmlFor="groundAlbedo"
          error={errors.groundAlbedo}
          hint="Reflectance of the ground in front of the façades; 0.2 is usual for urban ground."
        >
          <input
            id="groundAlbedo"
            type="number"
            step="any"
            min="0"
            max="1"
            {...register("groundAlbedo", { setValueAs: (v) => numberOrNull(v) ?? undefined })}
          />
        </Field>
        <Field label="Sky model" htmlFor="skyModel" error={errors.skyModel} hint="How diffuse sky light reaches a tilted surface.">
          <select id="skyModel" {...register("skyModel")}>
            {SKY_MODELS.map((m) => (
              <option key={m} value={m}>
                {SKY_MODEL_LABELS[m]}
              </option>
            ))}
          </select>
        </Field>
        <Field
          label="Linke turbidity, Jan–Dec"
          htmlFor="linkeTurbidity"
          error={errors.linkeTurbidity as { message?: string } | undefined}
          hint="Twelve values from 1 to 10, comma-separated; empty = Paneray's monthly defaults."
        >
          <input id="linkeTurbidity" placeholder="monthly defaults" {...register("linkeTurbidity", { setValueAs: monthlyValues })} />
        </Field>
        <div className="md:col-span-3">
          <Field
            label="Time zone"
            htmlFor="timeZone"
            error={worded(errors.timeZone)}
            hint="IANA name, e.g. Europe/Lisbon: fixes local clock time and daylight saving."
          >
            <input id="timeZone" list="tz-list" {...register("timeZone")} />
          </Field>
          <datalist id="tz-list">
            {zones.map((z) => (
              <option key={z} value={z} />
            ))}
          </datalist>
        </div>
      </fieldset>

      <fieldset className="card space-y-3">
        <legend className="px-1 font-bold">Façades</legend>
        <FacadePlan facades={watchedFacades} />
        <p className="text-xs text-slate">
          Azimuth of the outward normal in degrees clockwise from north (south = 180). Tilt from horizontal: 90 for a wall, less for sloped glazing.
          Glazed area gives W and kWh for the whole façade; the typical window (width × height) is what the shading devices (overhang, fins, horizon)
          shade. Removing a façade removes its options and their comments when you save.
        </p>
        {errors.facades?.message && <p className="field-error">{errors.facades.message}</p>}
        <ul className="space-y-2">
          {facades.fields.map((f, i) => (
            <li key={f.id} className="grid grid-cols-2 items-end gap-3 border-b border-line pb-3 sm:grid-cols-5" data-testid="facade-row">
              <div className="col-span-2 sm:col-span-4">
                <Field label={`Façade ${i + 1}: name`} htmlFor={`facades.${i}.name`} error={worded(errors.facades?.[i]?.name, i)}>
                  <input id={`facades.${i}.name`} {...register(`facades.${i}.name`)} />
                </Field>
              </div>
              <Field label="Azimuth °" htmlFor={`facades.${i}.azimuthDeg`} error={worded(errors.facades?.[i]?.azimuthDeg, i)}>
                <input id={`facades.${i}.azimuthDeg`} type="number" step="any" {...register(`facades.${i}.azimuthDeg`, { valueAsNumber: true })} />
              </Field>
              <Field label="Tilt °" htmlFor={`facades.${i}.tiltDeg`} error={worded(errors.facades?.[i]?.tiltDeg, i)}>
                <input id={`facades.${i}.tiltDeg`} type="number" step="any" {...register(`facades.${i}.tiltDeg`, { valueAsNumber: true })} />
              </Field>
              <Field label="Glazed m²" htmlFor={`facades.${i}.glazedAreaM2`} error={worded(errors.facades?.[i]?.glazedAreaM2, i)}>
                <input
                  id={`facades.${i}.glazedAreaM2`}
                  type="number"
                  step="any"
                  {...register(`facades.${i}.glazedAreaM2`, { setValueAs: numberOrNull })}
                />
              </Field>
              <Field label="Window width m" htmlFor={`facades.${i}.windowWidthM`} error={worded(errors.facades?.[i]?.windowWidthM, i)}>
                <input
                  id={`facades.${i}.windowWidthM`}
                  type="number"
                  step="any"
                  {...register(`facades.${i}.windowWidthM`, { setValueAs: numberOrNull })}
                />
              </Field>
              <Field label="Window height m" htmlFor={`facades.${i}.windowHeightM`} error={worded(errors.facades?.[i]?.windowHeightM, i)}>
                <input
                  id={`facades.${i}.windowHeightM`}
                  type="number"
                  step="any"
                  {...register(`facades.${i}.windowHeightM`, { setValueAs: numberOrNull })}
                />
              </Field>
              <button
                type="button"
                ref={(el) => {
                  if (el) removeButtons.current.set(f.id, el);
                  else removeButtons.current.delete(f.id);
                }}
                className="btn-quiet mb-0.5 sm:col-start-5 sm:row-start-1"
                onClick={() => (optionsOf(i) > 0 ? setConfirming(f.id) : removeRow(i))}
                aria-label={`Remove façade ${i + 1}`}
                aria-expanded={optionsOf(i) > 0 ? confirming === f.id : undefined}
              >
                Remove
              </button>
              {confirming === f.id && (
                <div
                  className="notice col-span-full"
                  role="alertdialog"
                  aria-labelledby={`confirm-facade-${i}`}
                  data-testid="remove-facade-confirmation"
                  onKeyDown={(ev) => {
                    if (ev.key === "Escape") keepRow(f.id);
                  }}
                >
                  <p id={`confirm-facade-${i}`}>
                    Remove façade {i + 1}
                    {watchedFacades[i]?.name ? ` (${watchedFacades[i]!.name})` : ""}? Its{" "}
                    {optionsOf(i) === 1 ? "glazing option goes" : `${optionsOf(i)} glazing options go`} with it, with their comments and decisions,
                    when you save.
                  </p>
                  <div className="mt-2 flex flex-wrap gap-2">
                    <button type="button" className="btn-danger" onClick={() => removeRow(i)}>
                      Remove façade and {optionsOf(i) === 1 ? "its option" : `its ${optionsOf(i)} options`}
                    </button>
                    <button type="button" className="btn-quiet" ref={keepButton} onClick={() => keepRow(f.id)}>
                      Keep the façade
                    </button>
                  </div>
                </div>
              )}
              <ShadingDevices i={i} facade={watchedFacades[i]} register={register} setValue={setValue} errors={errors} />
            </li>
          ))}
        </ul>
        <button
          type="button"
          ref={addButton}
          className="btn-quiet"
          onClick={() => {
            const az = (facades.fields.length * 90) % 360;
            facades.append({ name: compassPoint(az), azimuthDeg: az, tiltDeg: 90 });
          }}
        >
          Add a façade
        </button>
      </fieldset>

      <div className="flex gap-3">
        <button type="submit" className="btn" disabled={!hydrated || formState.isSubmitting}>
          {formState.isSubmitting ? "Saving…" : project ? "Save changes" : "Create project"}
        </button>
        <a className="btn-quiet" href={project ? `/projects/${project.id}` : "/dashboard"}>
          Cancel
        </a>
      </div>
    </form>
  );
}
