/** View models of the project pages (overview, edit, sun and schedules). */
import { roleCan, ROLE_LABELS, type RoleName } from "@/lib/auth/roles";
import type { WeatherSummary } from "@/lib/contracts/uploads";
import { weatherOf } from "@/lib/server/services/uploads";
import { requireProject, type ProjectRow } from "@/lib/server/services/access";
import { facadesOf, optionCountsOf, sharesOf, type ShareRow } from "@/lib/server/services/projects";
import { revisionListOf } from "@/lib/server/services/revisions";
import type { FacadeShading } from "@/lib/contracts/projects";

interface PageUser {
  id: string;
}

export interface FacadeView {
  id: string;
  name: string;
  azimuthDeg: number;
  tiltDeg: number;
  glazedAreaM2: number | null;
  windowWidthM: number | null;
  windowHeightM: number | null;
  shading: FacadeShading | null;
}

const facadeViews = async (projectId: string): Promise<FacadeView[]> =>
  (await facadesOf(projectId)).map((f) => ({
    id: f.id,
    name: f.name,
    azimuthDeg: f.azimuthDeg,
    tiltDeg: f.tiltDeg,
    glazedAreaM2: f.glazedAreaM2,
    windowWidthM: f.windowWidthM,
    windowHeightM: f.windowHeightM,
    shading: (f.shading as FacadeShading | null) ?? null,
  }));

export interface ProjectPage {
  project: ProjectRow;
  organizationName: string;
  role: RoleName;
  roleLabel: string;
  facades: FacadeView[];
  canEdit: boolean;
  canDelete: boolean;
  canShare: boolean;
  /** Who sees the project; empty unless canShare. */
  shares: ShareRow[];
  /** Drafts: options, requirements, results (not clients, who see only issued revisions). */
  canSeeDrafts: boolean;
  /** Add, re-point and remove options; set the requirements. */
  canAssign: boolean;
  /** Send issued workbooks by e-mail (the outbox): owners and consultants. */
  canSend: boolean;
  /** The issued schedule revisions, newest first (everyone who sees the project). */
  revisions: { letter: string; issuedAt: string; issuedBy: string; note: string | null; facadeCount: number }[];
  /** The project's weather file, or null when its results use the clear-sky model. */
  weather: WeatherSummary | null;
}

/** The project overview; NotFoundError when the project is missing or not visible to the user. */
export async function loadProjectPage(user: PageUser, projectId: string | undefined): Promise<ProjectPage> {
  const { project, membership } = await requireProject(user.id, projectId ?? "");
  const canShare = roleCan(membership.role, { project: ["share"] });
  return {
    project,
    organizationName: membership.organizationName,
    role: membership.role,
    roleLabel: ROLE_LABELS[membership.role],
    facades: await facadeViews(project.id),
    canEdit: roleCan(membership.role, { project: ["update"] }),
    canDelete: roleCan(membership.role, { project: ["delete"] }),
    canShare,
    shares: canShare ? await sharesOf(project) : [],
    canSeeDrafts: roleCan(membership.role, { project: ["readAll"] }),
    canAssign: roleCan(membership.role, { option: ["assign"] }),
    canSend: roleCan(membership.role, { export: ["create"] }),
    revisions: await revisionListOf(project.id),
    weather: await weatherOf(project.id),
  };
}

export interface ProjectEditPage {
  organization: { id: string; name: string };
  /** The project as the form edits it. */
  form: {
    id: string;
    name: string;
    reference: string;
    buildingName: string;
    siteName: string;
    latitudeDeg: number;
    longitudeDeg: number;
    timeZone: string;
    elevationM: number;
    groundAlbedo: number;
    skyModel: "perez" | "hay-davies" | "isotropic";
    linkeTurbidity: number[] | null;
    description: string;
    facades: FacadeView[];
  };
  /** Glazing options per façade id (absent = none): removing such a façade takes its options with it. */
  optionCounts: Record<string, number>;
}

/** The edit form; ForbiddenError (naming the role) when the user may see but not edit the project. */
export async function loadProjectEditPage(user: PageUser, projectId: string | undefined): Promise<ProjectEditPage> {
  const { project: p, membership } = await requireProject(user.id, projectId ?? "", { project: ["update"] }, "edit projects");
  return {
    organization: { id: p.organizationId, name: membership.organizationName },
    form: {
      id: p.id,
      name: p.name,
      reference: p.reference ?? "",
      buildingName: p.buildingName ?? "",
      siteName: p.siteName,
      latitudeDeg: p.latitudeDeg,
      longitudeDeg: p.longitudeDeg,
      timeZone: p.timeZone,
      elevationM: p.elevationM,
      groundAlbedo: p.groundAlbedo,
      skyModel: p.skyModel,
      linkeTurbidity: p.linkeTurbidity ?? null,
      description: p.description ?? "",
      facades: await facadeViews(p.id),
    },
    optionCounts: await optionCountsOf(p.id),
  };
}

export interface ProjectSunPage {
  project: ProjectRow;
  site: { latitudeDeg: number; longitudeDeg: number; timeZone: string; elevationM: number };
  facades: FacadeView[];
  year: number;
}

export async function loadProjectSunPage(user: PageUser, projectId: string | undefined, now = new Date()): Promise<ProjectSunPage> {
  const { project: p } = await requireProject(user.id, projectId ?? "");
  return {
    project: p,
    site: { latitudeDeg: p.latitudeDeg, longitudeDeg: p.longitudeDeg, timeZone: p.timeZone, elevationM: p.elevationM },
    facades: await facadeViews(p.id),
    year: now.getFullYear(),
  };
}
