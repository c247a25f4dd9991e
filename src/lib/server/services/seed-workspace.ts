/**
 * The demo's workspace: the firm's library, options on the Cordage Works façades, the brief's limits,
 * the architect's comments and approvals and revision A, made through the same services the API uses.
 * Runs once: when the demo organisation's library already holds make-ups it does nothing.
 */
import { and, eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, makeup, organization, project, user } from "@/lib/server/db/schema";
import { DEMO_MAKEUPS, DEMO_ORGANIZATION, DEMO_WORKSPACE, demoUser } from "@/lib/demo-scenario";
import { MakeupCreateRequest } from "@/lib/contracts/library";
import { CommentRequest, DecisionRequest } from "@/lib/contracts/review";
import { RequirementsRequest } from "@/lib/contracts/requirements";
import { createMakeup } from "./library";
import { createOption } from "./options";
import { putRequirements } from "./requirements";
import { addComment, decide } from "./review";
import { issueRevision } from "./revisions";

async function actor(role: "consultant" | "architect") {
  const u = (
    await db
      .select({ id: user.id, name: user.name })
      .from(user)
      .where(eq(user.email, demoUser(role).email))
  )[0];
  if (!u) throw new Error(`the demo ${role} is missing: seed the demo people first`);
  return u;
}

export async function seedDemoWorkspace(): Promise<string[]> {
  const org = (await db.select().from(organization).where(eq(organization.slug, DEMO_ORGANIZATION.slug)))[0];
  if (!org) return [];
  if ((await db.select({ id: makeup.id }).from(makeup).where(eq(makeup.organizationId, org.id)).limit(1)).length) return [];
  const consultant = await actor("consultant");
  const architect = await actor("architect");
  // Computed on this thread: the seed runs once, before the server starts.
  const ids = new Map<string, string>();
  for (const m of DEMO_MAKEUPS) {
    const saved = await createMakeup(org.id, consultant, MakeupCreateRequest.parse({ name: m.name, layers: m.layers, note: m.note }), null);
    ids.set(m.key, saved.id);
  }
  const created = [`${DEMO_MAKEUPS.length} library make-ups`];
  const p = (
    await db
      .select()
      .from(project)
      .where(and(eq(project.organizationId, org.id), eq(project.name, DEMO_WORKSPACE.project)))
  )[0];
  if (!p) return created;
  const facades = new Map((await db.select().from(facade).where(eq(facade.projectId, p.id))).map((f) => [f.name, f.id]));
  const optionIds = new Map<string, string>();
  for (const o of DEMO_WORKSPACE.options) {
    const entry = await createOption(p, consultant, { facadeId: facades.get(o.facade)!, makeupId: ids.get(o.makeup)!, name: o.name });
    optionIds.set(`${o.facade}/${o.name}`, entry.id);
  }
  await putRequirements(
    p,
    consultant,
    RequirementsRequest.parse({
      project: DEMO_WORKSPACE.requirements.project,
      facades: Object.fromEntries(Object.entries(DEMO_WORKSPACE.requirements.facades).map(([name, l]) => [facades.get(name)!, l])),
    }),
  );
  for (const c of DEMO_WORKSPACE.comments) {
    const id = optionIds.get(`${c.facade}/${c.option}`)!;
    const option = (await db.select().from(facadeOption).where(eq(facadeOption.id, id)))[0]!;
    const first = await addComment(option, architect, CommentRequest.parse({ body: c.architect }));
    await addComment(option, consultant, CommentRequest.parse({ body: c.reply, parentId: first.id }));
  }
  for (const o of DEMO_WORKSPACE.options.filter((x) => x.approve)) {
    await decide(
      optionIds.get(`${o.facade}/${o.name}`)!,
      architect,
      DecisionRequest.parse({ decision: "approved", note: "Agreed at the design review." }),
    );
  }
  await issueRevision(p.id, consultant, { note: DEMO_WORKSPACE.revisionNote, year: DEMO_WORKSPACE.year }, { pool: null });
  created.push(`${DEMO_WORKSPACE.options.length} options, requirements, comments, approvals and revision A on "${p.name}"`);
  return created;
}
