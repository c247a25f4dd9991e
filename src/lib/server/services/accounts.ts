import { eq } from "drizzle-orm";
import { auth } from "@/lib/server/auth";
import { db } from "@/lib/server/db/client";
import { organization, user } from "@/lib/server/db/schema";
import { ConflictError, fieldError, InvalidError } from "@/lib/server/errors";
import type { SignUpRequest } from "@/lib/contracts/auth";
import { acceptInvitation, invitationSummary } from "./members";

export function slugify(name: string): string {
  const base = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48);
  return base || "organisation";
}

/** Whether an account with this e-mail address exists. */
export async function accountExists(email: string): Promise<boolean> {
  const rows = await db.select({ id: user.id }).from(user).where(eq(user.email, email.toLowerCase())).limit(1);
  return rows.length > 0;
}

async function freeSlug(name: string): Promise<string> {
  const base = slugify(name);
  for (let i = 0; i < 20; i++) {
    const slug = i === 0 ? base : `${base}-${Math.random().toString(36).slice(2, 6)}`;
    const taken = await db.select({ id: organization.id }).from(organization).where(eq(organization.slug, slug));
    if (!taken.length) return slug;
  }
  return `${base}-${crypto.randomUUID().slice(0, 8)}`;
}

/**
 * Creates an account and signs it in. Without an invitation the new user founds an
 * organisation as its owner; with one, they join the inviting organisation in the invited role.
 * Returns better-auth's response headers (the session cookie).
 */
export async function signUp(input: SignUpRequest): Promise<{ headers: Headers; userId: string; organizationId: string }> {
  if (input.invitationId) {
    const inv = await invitationSummary(input.invitationId);
    if (!inv || inv.status !== "pending") throw new ConflictError("This invitation is no longer valid", [fieldError("invitationId", "not pending")]);
    if (inv.email.toLowerCase() !== input.email) {
      throw new InvalidError("email", "does not match the invitation", `This invitation is for ${inv.email}; sign up with that address`);
    }
  }
  const existing = await db.select({ id: user.id }).from(user).where(eq(user.email, input.email));
  if (existing.length)
    throw new ConflictError("An account with this e-mail already exists; sign in instead", [fieldError("email", "already registered")]);

  const { headers, response } = await auth.api.signUpEmail({
    body: { name: input.name, email: input.email, password: input.password },
    returnHeaders: true,
  });
  const userId = response.user.id;
  let organizationId: string;
  if (input.invitationId) {
    organizationId = (await acceptInvitation(userId, input.email, input.invitationId)).organizationId;
  } else {
    const org = await auth.api.createOrganization({
      body: { name: input.organizationName!, slug: await freeSlug(input.organizationName!), userId },
    });
    if (!org) throw new Error("organisation was not created");
    organizationId = org.id;
  }
  return { headers, userId, organizationId };
}
