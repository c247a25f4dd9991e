/** View models of the review pages: the options of every façade for the architect and the history. */
import type { MakeupValues } from "@/lib/contracts/results";
import { asc, eq } from "drizzle-orm";
import { roleCan, type RoleName } from "@/lib/auth/roles";
import { db } from "@/lib/server/db/client";
import { facadeOption, makeupRevision } from "@/lib/server/db/schema";
import { requireProject, type ProjectRow } from "@/lib/server/services/access";
import { facadesOf } from "@/lib/server/services/projects";
import { historyOf } from "@/lib/server/services/review";
import { permissionFor } from "@/lib/auth/roles";
import { InstantPageQuery } from "@/lib/contracts/pagination";
import type { HistoryResponse } from "@/lib/contracts/review";
import { lightText, makeupLight } from "@/lib/calc/makeup-light";

interface PageUser {
  id: string;
}

export interface ReviewOptionView {
  id: string;
  name: string;
  status: "proposed" | "approved" | "rejected";
  makeupName: string;
  makeupRevision: number;
  description: string;
  /** Key values stored with the make-up revision (null where not stored). */
  gValue: number | null;
  /** τv as text: "0.62", a range "0.60–0.66" (light reflectance unknown) or "unknown". */
  lightTransmittance: string;
  uValue: number | null;
}

export interface ReviewPage {
  project: ProjectRow;
  role: RoleName;
  canDecide: boolean;
  canComment: boolean;
  facades: { id: string; name: string; azimuthDeg: number; options: ReviewOptionView[] }[];
}

const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);
const at = (o: unknown, ...path: string[]): unknown =>
  path.reduce<unknown>((x, k) => (x && typeof x === "object" ? (x as Record<string, unknown>)[k] : undefined), o);

/** Every façade with its options and their key values; clients are refused (drafts are not theirs to see). */
export async function loadReviewPage(user: PageUser, projectId: string | undefined): Promise<ReviewPage> {
  const { project, membership } = await requireProject(user.id, projectId ?? "", permissionFor("project:readAll"), "see options under review");
  const rows = await db
    .select({ o: facadeOption, r: makeupRevision })
    .from(facadeOption)
    .innerJoin(makeupRevision, eq(makeupRevision.id, facadeOption.makeupRevisionId))
    .where(eq(facadeOption.projectId, project.id))
    .orderBy(asc(facadeOption.position), asc(facadeOption.createdAt));
  const facades = await facadesOf(project.id);
  return {
    project,
    role: membership.role,
    canDecide: roleCan(membership.role, permissionFor("option:review")),
    canComment: roleCan(membership.role, permissionFor("comment:create")),
    facades: facades.map((f) => ({
      id: f.id,
      name: f.name,
      azimuthDeg: f.azimuthDeg,
      options: rows
        .filter(({ o }) => o.facadeId === f.id)
        .map(({ o, r }) => ({
          id: o.id,
          name: o.name,
          status: o.status,
          makeupName: r.name,
          makeupRevision: r.revision,
          description: r.description,
          gValue: num(at(r.values, "normal", "gValue")),
          lightTransmittance: lightText(makeupLight(r.values as MakeupValues)),
          uValue: num(at(r.values, "uValue")),
        })),
    })),
  };
}

export interface HistoryPageView {
  project: ProjectRow;
  history: HistoryResponse;
}

/** One page of the project's history (`cursor` from the "more" link); clients are refused. */
export async function loadHistoryPage(user: PageUser, projectId: string | undefined, query: Record<string, string>): Promise<HistoryPageView> {
  const { project } = await requireProject(user.id, projectId ?? "", permissionFor("project:readAll"), "see the project's history");
  const q = InstantPageQuery.safeParse(query);
  return { project, history: await historyOf(project.id, q.success ? q.data : { limit: 50 }) };
}
