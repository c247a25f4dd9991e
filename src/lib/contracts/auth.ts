import { z } from "./zod";
import { email, name, password, plainString, rowId } from "./common";
import { ASSIGNABLE_ROLES } from "@/lib/auth/roles";

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

/** A member as the members endpoints send it (dates as ISO-8601 strings). */
export interface MemberEntry {
  memberId: string;
  userId: string;
  name: string;
  email: string;
  role: string;
  joinedAt: string;
}

/** A pending invitation as the members and invitations endpoints send it. */
export interface InvitationEntry {
  id: string;
  email: string;
  role: string | null;
  status: string;
  expiresAt: string;
  inviterName: string | null;
}
