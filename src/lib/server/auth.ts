/**
 * Sign-in, sessions and organisations (better-auth with its Drizzle adapter and the
 * organization plugin). Roles and their rights live in src/lib/auth/roles.ts.
 */
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { and, asc, eq, like, ne } from "drizzle-orm";
import { ac, roles, ROLE_LABELS, isRoleName } from "@/lib/auth/roles";
import { db } from "./db/client";
import * as schema from "./db/schema";
import { serverEnv } from "./env";
import { actionMail, sendMail } from "./mail";

const env = serverEnv();

export const INVITATION_TTL_SECONDS = 7 * 24 * 3600;

/** How long the link of a sign-up confirmation mail stays valid. */
export const EMAIL_VERIFICATION_TTL_SECONDS = 24 * 3600;

/**
 * Sends a mail without holding up the request: the answer must not take longer for a known address than
 * for an unknown one. Failures are logged.
 */
export function sendInBackground(what: string, task: () => Promise<unknown>): void {
  void task().catch((err: unknown) => console.error(`[mail] ${what} failed:`, (err as Error)?.message ?? err));
}

/** Header through which the auth route hands the client address to better-auth (any value the client sent is replaced). */
export const CLIENT_IP_HEADER = "x-paneray-client-ip";

export const auth = betterAuth({
  appName: "Paneray",
  baseURL: env.BETTER_AUTH_URL,
  secret: env.BETTER_AUTH_SECRET,
  trustedOrigins: env.TRUSTED_ORIGINS.split(",")
    .map((s) => s.trim())
    .filter(Boolean),
  database: drizzleAdapter(db, { provider: "pg", schema }),
  telemetry: { enabled: false },
  // Failures that are not better-auth's own refusals reach our route (src/pages/api/auth/[...all].ts),
  // which answers a lost database 503 with Retry-After instead of a bare 500.
  onAPIError: { throw: true },
  // Limits are counted in PostgreSQL by lib/server/auth-gate.ts and the sign-up endpoint (shared by all servers).
  rateLimit: { enabled: false },
  // One query (session joined with its user) per session lookup instead of two.
  advanced: { ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] }, database: { joins: true } },
  emailAndPassword: {
    enabled: true,
    minPasswordLength: 8,
    // Accounts are created by Paneray's sign-up (services/accounts.ts) and must confirm their address first.
    disableSignUp: true,
    requireEmailVerification: true,
    resetPasswordTokenExpiresIn: 3600,
    revokeSessionsOnPasswordReset: true,
    sendResetPassword({ user, url, token }) {
      sendInBackground("password-reset mail", async () => {
        // Only the newest link works: earlier reset tokens of this user are dropped.
        await db
          .delete(schema.verification)
          .where(
            and(
              eq(schema.verification.value, user.id),
              like(schema.verification.identifier, "reset-password:%"),
              ne(schema.verification.identifier, `reset-password:${token}`),
            ),
          );
        await sendMail(
          actionMail({
            to: user.email,
            subject: "Reset your Paneray password",
            lines: [
              `Hello ${user.name},`,
              "Someone (we hope you) asked to reset the password of your Paneray account.",
              "The link below is valid for one hour. If you did not ask for it, ignore this message.",
            ],
            actionLabel: "Choose a new password",
            url,
          }),
        );
      });
      return Promise.resolve();
    },
  },
  emailVerification: {
    sendOnSignUp: false,
    sendOnSignIn: true,
    autoSignInAfterVerification: true,
    expiresIn: EMAIL_VERIFICATION_TTL_SECONDS,
    sendVerificationEmail({ user, url }) {
      sendInBackground("address confirmation mail", () =>
        sendMail(
          actionMail({
            to: user.email,
            subject: "Confirm your e-mail address for Paneray",
            lines: [
              `Hello ${user.name},`,
              "Someone (we hope you) created a Paneray account with this address.",
              "Confirm the address to start using the account; the link is valid for 24 hours. If it was not you, ignore this message.",
            ],
            actionLabel: "Confirm my address",
            url,
          }),
        ),
      );
      return Promise.resolve();
    },
  },
  databaseHooks: {
    session: {
      create: {
        // A new session starts in the user's oldest organisation.
        async before(session) {
          const first = await db
            .select({ organizationId: schema.member.organizationId })
            .from(schema.member)
            .where(eq(schema.member.userId, session.userId))
            .orderBy(asc(schema.member.createdAt))
            .limit(1);
          return { data: { ...session, activeOrganizationId: first[0]?.organizationId ?? null } };
        },
      },
    },
  },
  plugins: [
    organization({
      ac,
      roles,
      creatorRole: "owner",
      // Organisations are founded by Paneray's sign-up only.
      allowUserToCreateOrganization: false,
      invitationExpiresIn: INVITATION_TTL_SECONDS,
      cancelPendingInvitationsOnReInvite: true,
      async sendInvitationEmail({ id, email, role, organization: org, inviter }) {
        const roleLabel = isRoleName(role) ? ROLE_LABELS[role] : role;
        await sendMail(
          actionMail({
            to: email,
            subject: `${inviter.user.name} invited you to ${org.name} on Paneray`,
            lines: [
              "Hello,",
              `${inviter.user.name} (${inviter.user.email}) invited you to join ${org.name} on Paneray as ${roleLabel}.`,
              "Paneray is where façade consultants, architects and clients work out how much sun each glazing option lets into a building.",
              "The invitation is valid for 7 days.",
            ],
            actionLabel: "Accept the invitation",
            url: `${env.BETTER_AUTH_URL}/invitations/${id}`,
          }),
        );
      },
    }),
  ],
});

export type AuthUser = typeof auth.$Infer.Session.user;
export type AuthSession = typeof auth.$Infer.Session.session;
