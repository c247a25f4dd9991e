/**
 * Paneray's organisation roles and what each may do.
 *
 * This module is pure (no I/O) so the same rules run on the server, where they are
 * enforced, and in the browser, where they only decide what to show.
 *
 * - owner       manages the organisation and its members; full project rights.
 * - consultant  creates and edits projects, glazing and façade options; shares and exports.
 * - architect   reads every project of the organisation, comments, approves or rejects options.
 * - client      reads the projects shared with them and receives exports.
 */
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements, ownerAc } from "better-auth/plugins/organization/access";

export const statements = {
  ...defaultStatements,
  /** readAll: every project of the organisation; readShared: only projects shared with the member. */
  project: ["create", "readAll", "readShared", "update", "delete", "share"],
  /** The organisation's glazing library (saved panes and make-ups). */
  glazing: ["read", "create", "update", "delete"],
  /** assign: add, rename, re-point and remove a façade's options; review: approve or reject them. */
  option: ["assign", "review"],
  comment: ["create"],
  /** Issuing a lettered schedule revision. */
  revision: ["issue"],
  export: ["create", "receive"],
  /** manage: create, list and revoke the organisation's API keys. */
  apiKey: ["manage"],
} as const;

export const ac = createAccessControl(statements);

const projectWork = {
  project: ["create", "readAll", "readShared", "update", "delete", "share"],
  glazing: ["read", "create", "update", "delete"],
  option: ["assign"],
  comment: ["create"],
  revision: ["issue"],
  export: ["create", "receive"],
} as const;

export const owner = ac.newRole({
  ...ownerAc.statements,
  ...projectWork,
  option: ["assign", "review"],
  apiKey: ["manage"],
});

export const consultant = ac.newRole({ ...projectWork });

export const architect = ac.newRole({
  project: ["readAll", "readShared"],
  glazing: ["read"],
  option: ["review"],
  comment: ["create"],
  export: ["receive"],
});

export const client = ac.newRole({
  project: ["readShared"],
  export: ["receive"],
});

export const roles = { owner, consultant, architect, client } as const;

export type RoleName = keyof typeof roles;
/** Every role, as a tuple so that schemas (`z.enum(ROLE_NAMES)`) infer `RoleName`. */
export const ROLE_NAMES = ["owner", "consultant", "architect", "client"] as const satisfies readonly RoleName[];
// A role added to `roles` but not to ROLE_NAMES fails to compile here.
const _everyRoleListed: Exclude<RoleName, (typeof ROLE_NAMES)[number]> extends never ? true : never = true;
void _everyRoleListed;

/** Roles an owner may give in an invitation or a role change ("owner" included: an organisation may have several). */
export const ASSIGNABLE_ROLES = ["owner", "consultant", "architect", "client"] as const satisfies readonly RoleName[];

export const ROLE_LABELS: Record<RoleName, string> = {
  owner: "Owner",
  consultant: "Consultant",
  architect: "Architect",
  client: "Client",
};

export const ROLE_SUMMARIES: Record<RoleName, string> = {
  owner: "Manages the organisation and its members; full project rights.",
  consultant: "Creates and edits projects, glazing and façade options.",
  architect: "Reads all projects, comments, approves or rejects options.",
  client: "Reads the projects shared with them and receives exports.",
};

export type Permission = { [K in keyof typeof statements]?: readonly (typeof statements)[K][number][] };

type Statements = typeof statements;
/** One action on one resource, written "resource:action" (e.g. "project:update"). */
export type PermissionKey = { [K in keyof Statements]: `${K & string}:${Statements[K][number]}` }[keyof Statements];

/** How refusals name each action ("Your role (client) does not allow you to edit projects"). */
export const PERMISSION_PHRASES: Partial<Record<PermissionKey, string>> = {
  "project:create": "create projects",
  "project:update": "edit projects",
  "project:delete": "delete projects",
  "project:share": "share projects",
  "member:update": "manage members",
  "member:delete": "remove members",
  "invitation:create": "invite members",
  "invitation:cancel": "cancel invitations",
  "project:readAll": "see drafts, options and comments",
  "glazing:read": "read the glazing library",
  "glazing:create": "add to the glazing library",
  "glazing:update": "edit the glazing library",
  "glazing:delete": "delete from the glazing library",
  "option:assign": "change façade options",
  "option:review": "approve or reject options",
  "comment:create": "comment on options",
  "revision:issue": "issue schedule revisions",
  "export:create": "export or send schedules",
  "apiKey:manage": "manage API keys",
  "organization:update": "see the organisation's history",
};

/** The permission object for a "resource:action" key. */
export function permissionFor(key: PermissionKey): Permission {
  const [resource, action] = key.split(":") as [keyof Statements, string];
  return { [resource]: [action] } as Permission;
}

export function isRoleName(value: unknown): value is RoleName {
  return typeof value === "string" && (ROLE_NAMES as readonly string[]).includes(value);
}

/**
 * Whether a member whose role string is `role` holds every action in `permission`.
 * better-auth stores several roles comma-separated; any of them granting is enough.
 */
export function roleCan(role: string | null | undefined, permission: Permission): boolean {
  if (!role) return false;
  return role
    .split(",")
    .map((r) => r.trim())
    .filter(isRoleName)
    .some((r) => roles[r].authorize(permission as never).success);
}
