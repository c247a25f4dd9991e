import { eq } from "drizzle-orm";
import { hashPassword } from "better-auth/crypto";
import { auth, sendInBackground } from "@/lib/server/auth";
import { db } from "@/lib/server/db/client";
import { account, member, organization, user } from "@/lib/server/db/schema";
import { serverEnv } from "@/lib/server/env";
import { actionMail, sendMail } from "@/lib/server/mail";
import { ConflictError, fieldError, InvalidError } from "@/lib/server/errors";
import type { SignUpRequest } from "@/lib/contracts/auth";
import { invitationSummary, joinByInvitation } from "./members";

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

async function freeSlug(tx: Tx, name: string): Promise<string> {
  const base = slugify(name);
  for (let i = 0; i < 20; i++) {
    const slug = i === 0 ? base : `${base}-${Math.random().toString(36).slice(2, 6)}`;
    const taken = await tx.select({ id: organization.id }).from(organization).where(eq(organization.slug, slug));
    if (!taken.length) return slug;
  }
  return `${base}-${crypto.randomUUID().slice(0, 8)}`;
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Inserts the user and their password credential (one transaction's part). */
async function insertUser(tx: Tx, input: SignUpRequest, passwordHash: string, emailVerified: boolean): Promise<string> {
  const userId = crypto.randomUUID();
  const now = new Date();
  await tx.insert(user).values({ id: userId, name: input.name, email: input.email, emailVerified, createdAt: now, updatedAt: now });
  await tx
    .insert(account)
    .values({ id: crypto.randomUUID(), accountId: userId, providerId: "credential", userId, password: passwordHash, createdAt: now, updatedAt: now });
  return userId;
}

const isUniqueViolation = (err: unknown): boolean => {
  for (let e = err as { code?: unknown; cause?: unknown } | undefined; e; e = e.cause as typeof e) if (e.code === "23505") return true;
  return false;
};

/** What a sign-up without invitation answers, whether or not the address was known. */
export const SIGN_UP_PENDING_MESSAGE =
  "Check your inbox: we sent a link to confirm your e-mail address. The account can be used once it is confirmed.";

export type SignUpResult =
  /** A new organisation's owner (or an address that already has an account): a confirmation mail went out, nobody is signed in. */
  { kind: "pending-verification"; userId: string | null; organizationId: string | null } | SignedInResult;

/** An invitation's sign-up: the invitation proves the address, so the account is signed in at once. */
export interface SignedInResult {
  kind: "signed-in";
  headers: Headers;
  userId: string;
  organizationId: string;
}

function tellOwnerOfAddress(email: string) {
  sendInBackground("sign-up notice", () =>
    sendMail(
      actionMail({
        to: email,
        subject: "Someone tried to create a Paneray account with your address",
        lines: [
          "Hello,",
          "Someone (perhaps you) tried to create a new Paneray account with this e-mail address, which already has an account. No new account was created.",
          "If it was you, sign in instead; if you forgot your password, choose a new one from the sign-in page. Otherwise you can ignore this message.",
        ],
        actionLabel: "Sign in",
        url: `${serverEnv().BETTER_AUTH_URL}/signin`,
      }),
    ),
  );
}

async function sendConfirmation(email: string) {
  await auth.api.sendVerificationEmail({ body: { email, callbackURL: "/dashboard" } });
}

/**
 * Creates an account. Without an invitation the user, a new organisation and the owner membership are written in
 * one transaction and a confirmation link is mailed; the account cannot sign in before the address is confirmed.
 * An address that already has an account gets the same answer (and a notice by mail instead), so sign-up does not
 * reveal which addresses are registered. With an invitation (which proves the address) the verified user joins the
 * inviting organisation in the invited role, in one transaction, and is signed in (the result carries the cookie).
 */
export async function signUp(input: SignUpRequest & { invitationId: string }): Promise<SignedInResult>;
export async function signUp(input: SignUpRequest): Promise<SignUpResult>;
export async function signUp(input: SignUpRequest): Promise<SignUpResult> {
  if (input.invitationId) return signUpByInvitation(input, input.invitationId);
  // Hashed before looking the address up, so that a known address takes as long as a new one.
  const passwordHash = await hashPassword(input.password);
  const existing = (await db.select({ id: user.id, emailVerified: user.emailVerified }).from(user).where(eq(user.email, input.email)))[0];
  if (existing) {
    if (existing.emailVerified) tellOwnerOfAddress(input.email);
    else await sendConfirmation(input.email);
    return { kind: "pending-verification", userId: null, organizationId: null };
  }
  let created: { userId: string; organizationId: string };
  try {
    created = await db.transaction(async (tx) => {
      const userId = await insertUser(tx, input, passwordHash, false);
      const organizationId = crypto.randomUUID();
      const now = new Date();
      await tx
        .insert(organization)
        .values({ id: organizationId, name: input.organizationName!, slug: await freeSlug(tx, input.organizationName!), createdAt: now });
      await tx.insert(member).values({ id: crypto.randomUUID(), organizationId, userId, role: "owner", createdAt: now });
      return { userId, organizationId };
    });
  } catch (err) {
    // The same address signed up at the same moment: answer as for a known address.
    if (isUniqueViolation(err)) {
      tellOwnerOfAddress(input.email);
      return { kind: "pending-verification", userId: null, organizationId: null };
    }
    throw err;
  }
  await sendConfirmation(input.email);
  return { kind: "pending-verification", ...created };
}

async function signUpByInvitation(input: SignUpRequest, invitationId: string): Promise<SignedInResult> {
  const inv = await invitationSummary(invitationId);
  if (!inv || inv.status !== "pending") throw new ConflictError("This invitation is no longer valid", [fieldError("invitationId", "not pending")]);
  if (inv.email.toLowerCase() !== input.email) {
    throw new InvalidError("email", "does not match the invitation", `This invitation is for ${inv.email}; sign up with that address`);
  }
  if (await accountExists(input.email)) {
    throw new ConflictError("An account with this e-mail already exists; sign in instead", [fieldError("email", "already registered")]);
  }
  const passwordHash = await hashPassword(input.password);
  let userId: string;
  try {
    userId = await db.transaction(async (tx) => {
      const id = await insertUser(tx, input, passwordHash, true);
      await joinByInvitation(tx, id, input.email, invitationId);
      return id;
    });
  } catch (err) {
    if (isUniqueViolation(err))
      throw new ConflictError("An account with this e-mail already exists; sign in instead", [fieldError("email", "already registered")]);
    throw err;
  }
  const { headers } = await auth.api.signInEmail({ body: { email: input.email, password: input.password }, returnHeaders: true });
  return { kind: "signed-in", headers, userId, organizationId: inv.organizationId };
}
