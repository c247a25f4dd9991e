import { and, eq } from "drizzle-orm";
import { hashPassword } from "better-auth/crypto";
import { db } from "@/lib/server/db/client";
import { account, facade, member, organization, project, projectShare, user } from "@/lib/server/db/schema";
import { DEMO_ORGANIZATION, DEMO_PASSWORD, DEMO_PROJECTS, DEMO_USERS } from "@/lib/demo-scenario";

/** Inserts whatever part of the demo scenario is missing; returns what it created. */
export async function seedDemo(): Promise<string[]> {
  const created: string[] = [];
  return db.transaction(async (tx) => {
    let org = (await tx.select().from(organization).where(eq(organization.slug, DEMO_ORGANIZATION.slug)))[0];
    if (!org) {
      [org] = await tx
        .insert(organization)
        .values({ id: crypto.randomUUID(), ...DEMO_ORGANIZATION, createdAt: new Date() })
        .returning();
      created.push("organisation");
    }
    const orgId = org!.id;
    const memberIds = new Map<string, string>();
    for (const demo of DEMO_USERS) {
      let u = (await tx.select().from(user).where(eq(user.email, demo.email)))[0];
      if (!u) {
        [u] = await tx.insert(user).values({ id: crypto.randomUUID(), name: demo.name, email: demo.email, emailVerified: true }).returning();
        await tx.insert(account).values({
          id: crypto.randomUUID(),
          accountId: u!.id,
          providerId: "credential",
          userId: u!.id,
          password: await hashPassword(DEMO_PASSWORD),
        });
        created.push(demo.email);
      }
      let m = (
        await tx
          .select()
          .from(member)
          .where(and(eq(member.userId, u!.id), eq(member.organizationId, orgId)))
      )[0];
      if (!m) {
        [m] = await tx
          .insert(member)
          .values({ id: crypto.randomUUID(), organizationId: orgId, userId: u!.id, role: demo.role, createdAt: new Date() })
          .returning();
      }
      memberIds.set(demo.role, m!.id);
    }
    const creator = (await tx.select().from(user).where(eq(user.email, DEMO_USERS[1]!.email)))[0]!;
    for (const p of DEMO_PROJECTS) {
      const exists = await tx
        .select({ id: project.id })
        .from(project)
        .where(and(eq(project.organizationId, orgId), eq(project.name, p.name)));
      if (exists.length) continue;
      const { facades, sharedWithClient, ...fields } = p;
      const [row] = await tx
        .insert(project)
        .values({ ...fields, organizationId: orgId, createdById: creator.id })
        .returning();
      await tx.insert(facade).values(facades.map((f, i) => ({ ...f, projectId: row!.id, position: i })));
      if (sharedWithClient) {
        await tx.insert(projectShare).values({ projectId: row!.id, memberId: memberIds.get("client")!, sharedById: creator.id });
      }
      created.push(`project "${p.name}"`);
    }
    return created;
  });
}
