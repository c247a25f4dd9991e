/** View models of the results page and of an issued revision's page. */
import { roleCan } from "@/lib/auth/roles";
import type { RevisionResponse } from "@/lib/contracts/results";
import { RevisionLetter } from "@/lib/contracts/revisions";
import { NotFoundError } from "@/lib/server/errors";
import { requireProject, type ProjectRow } from "@/lib/server/services/access";
import { siteOf } from "@/lib/server/services/results";
import { revisionOf } from "@/lib/server/services/revisions";

interface PageUser {
  id: string;
}

export interface ResultsPage {
  project: ProjectRow;
  site: ReturnType<typeof siteOf>;
  year: number;
  canIssue: boolean;
}

/** The results page: drafts and options, so not for clients (403 naming the role). */
export async function loadResultsPage(user: PageUser, projectId: string | undefined, now = new Date()): Promise<ResultsPage> {
  const { project, membership } = await requireProject(user.id, projectId ?? "", { project: ["readAll"] }, "see drafts, options and comments");
  return { project, site: siteOf(project), year: now.getFullYear(), canIssue: roleCan(membership.role, { revision: ["issue"] }) };
}

export interface RevisionPage {
  project: ProjectRow;
  revision: RevisionResponse;
  /** Whether the reader may also open the working results (not clients). */
  canSeeResults: boolean;
}

/** An issued revision, read-only; clients of a shared project see it too. */
export async function loadRevisionPage(user: PageUser, projectId: string | undefined, letter: string | undefined): Promise<RevisionPage> {
  const { project, membership } = await requireProject(user.id, projectId ?? "");
  const parsed = RevisionLetter.safeParse(letter);
  if (!parsed.success) throw new NotFoundError("There is no such revision");
  return { project, revision: await revisionOf(project.id, parsed.data), canSeeResults: roleCan(membership.role, { project: ["readAll"] }) };
}
