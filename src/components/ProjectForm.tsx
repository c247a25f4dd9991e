import { useMemo, useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
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

export default function ProjectForm({ organizations, defaultOrganizationId, project }: Props) {
  const hydrated = useHydrated();
  const [failure, setFailure] = useState<string | null>(null);
  const zones = useMemo(() => (typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : []), []);
  const { register, handleSubmit, control, formState, setError } = useForm<Input, unknown, Output>({
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
      applyServerErrors(err.errors, FIELDS, setError);
      setFailure(err.message);
    }
  });

  return (
    <form method="post" onSubmit={onSubmit} className="space-y-6" noValidate>
      {failure && <FormMessage kind="error">{failure}</FormMessage>}
      <fieldset className="card grid gap-4 md:grid-cols-2">
        <legend className="px-1 font-bold">Project</legend>
        {!project && organizations.length > 1 && (
          <Field label="Organisation" htmlFor="organizationId" error={errors.organizationId}>
            <select id="organizationId" {...register("organizationId")}>
              {organizations.map((o) => (
                <option key={o.id} value={o.id}>
                  {o.name}
                </option>
              ))}
            </select>
          </Field>
        )}
        <Field label="Project name" htmlFor="name" error={errors.name}>
          <input id="name" {...register("name")} />
        </Field>
        <Field label="Job number" htmlFor="reference" error={errors.reference} hint="Your firm's reference, optional.">
          <input id="reference" {...register("reference")} />
        </Field>
        <Field label="Building" htmlFor="buildingName" error={errors.buildingName}>
          <input id="buildingName" {...register("buildingName")} />
        </Field>
        <div className="md:col-span-2">
          <Field label="Description" htmlFor="description" error={errors.description}>
            <textarea id="description" rows={3} {...register("description")} />
          </Field>
        </div>
      </fieldset>

      <fieldset className="card grid gap-4 md:grid-cols-3">
        <legend className="px-1 font-bold">Site</legend>
        <div className="md:col-span-3">
          <Field label="Site name" htmlFor="siteName" error={errors.siteName}>
            <input id="siteName" {...register("siteName")} />
          </Field>
        </div>
        <Field label="Latitude (°, north +)" htmlFor="latitudeDeg" error={errors.latitudeDeg}>
          <input id="latitudeDeg" type="number" step="any" {...register("latitudeDeg", { valueAsNumber: true })} />
        </Field>
        <Field label="Longitude (°, east +)" htmlFor="longitudeDeg" error={errors.longitudeDeg}>
          <input id="longitudeDeg" type="number" step="any" {...register("longitudeDeg", { valueAsNumber: true })} />
        </Field>
        <Field label="Elevation (m)" htmlFor="elevationM" error={errors.elevationM}>
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
            error={errors.timeZone}
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
          Glazed area gives W and kWh for the whole façade; the typical window (width × height) is what overhangs and fins shade. Removing a façade
          removes its options and their comments when you save.
        </p>
        {errors.facades?.message && <p className="field-error">{errors.facades.message}</p>}
        <ul className="space-y-2">
          {facades.fields.map((f, i) => (
            <li
              key={f.id}
              className="grid grid-cols-2 items-end gap-3 border-b border-line pb-3 sm:grid-cols-[1fr_110px_90px_110px_100px_100px_auto]"
              data-testid="facade-row"
            >
              <Field label="Name" htmlFor={`facades.${i}.name`} error={errors.facades?.[i]?.name}>
                <input id={`facades.${i}.name`} {...register(`facades.${i}.name`)} />
              </Field>
              <Field label="Azimuth °" htmlFor={`facades.${i}.azimuthDeg`} error={errors.facades?.[i]?.azimuthDeg}>
                <input id={`facades.${i}.azimuthDeg`} type="number" step="any" {...register(`facades.${i}.azimuthDeg`, { valueAsNumber: true })} />
              </Field>
              <Field label="Tilt °" htmlFor={`facades.${i}.tiltDeg`} error={errors.facades?.[i]?.tiltDeg}>
                <input id={`facades.${i}.tiltDeg`} type="number" step="any" {...register(`facades.${i}.tiltDeg`, { valueAsNumber: true })} />
              </Field>
              <Field label="Glazed m²" htmlFor={`facades.${i}.glazedAreaM2`} error={errors.facades?.[i]?.glazedAreaM2}>
                <input
                  id={`facades.${i}.glazedAreaM2`}
                  type="number"
                  step="any"
                  {...register(`facades.${i}.glazedAreaM2`, { setValueAs: numberOrNull })}
                />
              </Field>
              <Field label="Window w m" htmlFor={`facades.${i}.windowWidthM`} error={errors.facades?.[i]?.windowWidthM}>
                <input
                  id={`facades.${i}.windowWidthM`}
                  type="number"
                  step="any"
                  {...register(`facades.${i}.windowWidthM`, { setValueAs: numberOrNull })}
                />
              </Field>
              <Field label="Window h m" htmlFor={`facades.${i}.windowHeightM`} error={errors.facades?.[i]?.windowHeightM}>
                <input
                  id={`facades.${i}.windowHeightM`}
                  type="number"
                  step="any"
                  {...register(`facades.${i}.windowHeightM`, { setValueAs: numberOrNull })}
                />
              </Field>
              <button type="button" className="btn-quiet mb-0.5" onClick={() => facades.remove(i)} aria-label={`Remove façade ${i + 1}`}>
                Remove
              </button>
            </li>
          ))}
        </ul>
        <button
          type="button"
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
