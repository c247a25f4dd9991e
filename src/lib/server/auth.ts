/**
 * Sign-in, sessions and organisations (better-auth with its Drizzle adapter and the
 * organization plugin). Roles and their rights live in src/lib/auth/roles.ts.
 */
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { asc, eq } from "drizzle-orm";
import { ac, roles, ROLE_LABELS, isRoleName } from "@/lib/auth/roles";
import { db } from "./db/client";
import * as schema from "./db/schema";
import { serverEnv } from "./env";
import { actionMail, sendMail } from "./mail";

const env = serverEnv();

export const INVITATION_TTL_SECONDS = 7 * 24 * 3600;

/** Header through which the auth route hands the socket's client address to better-auth. */
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
  rateLimit: { enabled: env.AUTH_RATE_LIMIT !== "off" },
  advanced: { ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] } },
  emailAndPassword: {
    enabled: true,
    minPasswordLength: 8,
    resetPasswordTokenExpiresIn: 3600,
    revokeSessionsOnPasswordReset: true,
    async sendResetPassword({ user, url }) {
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
