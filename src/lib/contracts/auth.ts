import { z } from "./zod";
import { keyScopeSchema } from "./api-keys";
import { email, name, password, plainString, rowId } from "./common";
import { ASSIGNABLE_ROLES, ROLE_NAMES } from "@/lib/auth/roles";
import { id, instant, nextCursor } from "./wire";

export const SignUpRequest = z
  .object({
    name: name("name", 120),
    email,
    password,
    /** Required unless the sign-up accepts an invitation. */
    organizationName: name("organizationName", 120).optional(),
    invitationId: rowId.optional(),
  })
  .refine((v) => v.organizationName || v.invitationId, {
    path: ["organizationName"],
    message: "organizationName is required (the firm you work for)",
  });
export type SignUpRequest = z.infer<typeof SignUpRequest>;

export const SignInRequest = z.object({
  email,
  password: plainString("password").pipe(z.string().min(1, "password is required").max(128, "password must be at most 128 characters")),
});

/** A role an owner may give; the parsed value is a `RoleName`. */
export const role = z.enum(ASSIGNABLE_ROLES, {
  error: `role must be one of ${ASSIGNABLE_ROLES.join(", ")}`,
});

export const InvitationRequest = z.object({ email, role });
export type InvitationRequest = z.infer<typeof InvitationRequest>;
export const MemberRoleRequest = z.object({ role });
export type MemberRoleRequest = z.infer<typeof MemberRoleRequest>;

// ---- responses ------------------------------------------------------------------------------------------------

/** A member as the members endpoints send it (dates as ISO-8601 strings). */
export const MemberEntry = z.object({
  memberId: id,
  userId: id,
  name: z.string(),
  email: z.string(),
  role: z.string().describe("owner, consultant, architect or client"),
  joinedAt: instant,
});
export type MemberEntry = z.output<typeof MemberEntry>;

/** A pending invitation as the members and invitations endpoints send it. */
export const InvitationEntry = z.object({
  id,
  email: z.string(),
  role: z.string().nullable(),
  status: z.string().describe('"pending" in these lists'),
  expiresAt: instant,
  inviterName: z.string().nullable(),
});
export type InvitationEntry = z.output<typeof InvitationEntry>;

/** One of the caller's organisations with their role there. */
export const MembershipEntry = z.object({
  memberId: id,
  organizationId: id,
  organizationName: z.string(),
  organizationSlug: z.string(),
  role: z.enum(ROLE_NAMES),
});

export const MeResponse = z.object({
  user: z.object({ id, name: z.string(), email: z.string() }),
  memberships: z.array(MembershipEntry).describe("Oldest membership first; with an API key, the key's organisation only"),
  apiKey: z
    .object({ id, name: z.string(), scope: keyScopeSchema, organizationId: id })
    .optional()
    .describe("The API key the request carried (absent for a session)"),
});

export const SignUpResponse = z.union([
  z.object({
    status: z.literal("verification-sent"),
    message: z.string().describe("The same answer whether or not the address already has an account"),
  }),
  z.object({ userId: id, organizationId: id.describe("The organisation joined through the invitation") }),
]);

/** What an invitation link is for, before sign-in. */
export const InvitationSummary = z.object({
  id,
  email: z.string(),
  role: z.enum(ROLE_NAMES),
  organizationId: id,
  organizationName: z.string(),
  inviterName: z.string().nullable(),
  status: z.enum(["pending", "accepted", "expired", "canceled", "rejected"]),
  expiresAt: instant,
});
export const InvitationSummaryResponse = z.object({ invitation: InvitationSummary });

export const MembersPageResponse = z.object({
  members: z.array(MemberEntry).describe("One page, oldest membership first"),
  nextCursor,
  invitations: z.array(InvitationEntry).describe("The first page of pending invitations"),
  invitationsNextCursor: nextCursor,
});
export const MemberListResponse = z.object({ members: z.array(MemberEntry).describe("The first page of members after the change") });
export const InvitationsPageResponse = z.object({ invitations: z.array(InvitationEntry), nextCursor });
export const InvitationListResponse = z.object({ invitations: z.array(InvitationEntry).describe("The pending invitations after the change") });
export const InvitationCreatedResponse = z.object({
  invitation: z
    .looseObject({ id, email: z.string(), role: z.string(), status: z.string(), organizationId: id, expiresAt: instant })
    .describe("The invitation as stored (further members may be present)"),
  invitations: z.array(InvitationEntry),
});
