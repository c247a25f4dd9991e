// The role rules of the product (README, Roles): owner manages members and the organisation; consultant creates and
// edits projects and glazing; architect reads, comments, approves or rejects options; client reads shared
// projects and receives exports. Expected values follow that table, not the implementation.
import { describe, expect, it } from "vitest";
import { roleCan, roles, isRoleName, ROLE_NAMES, type Permission, type RoleName } from "@/lib/auth/roles";

const table: [Permission, Record<RoleName, boolean>][] = [
  [{ member: ["create"] }, { owner: true, consultant: false, architect: false, client: false }],
  [{ member: ["update"] }, { owner: true, consultant: false, architect: false, client: false }],
  [{ invitation: ["create"] }, { owner: true, consultant: false, architect: false, client: false }],
  [{ organization: ["delete"] }, { owner: true, consultant: false, architect: false, client: false }],
  [{ organization: ["update"] }, { owner: true, consultant: false, architect: false, client: false }],
  [{ project: ["create"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ project: ["update"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ project: ["delete"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ project: ["share"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ project: ["readAll"] }, { owner: true, consultant: true, architect: true, client: false }],
  [{ project: ["readShared"] }, { owner: true, consultant: true, architect: true, client: true }],
  [{ glazing: ["create"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ option: ["assign"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ option: ["review"] }, { owner: true, consultant: false, architect: true, client: false }],
  [{ comment: ["create"] }, { owner: true, consultant: true, architect: true, client: false }],
  [{ export: ["create"] }, { owner: true, consultant: true, architect: false, client: false }],
  [{ export: ["receive"] }, { owner: true, consultant: true, architect: true, client: true }],
  // Owners manage the organisation, its API keys included (README, API keys).
  [{ apiKey: ["manage"] }, { owner: true, consultant: false, architect: false, client: false }],
];

describe("role rules", () => {
  it("knows exactly the four roles", () => {
    expect([...ROLE_NAMES].sort()).toEqual(["architect", "client", "consultant", "owner"]);
    expect(Object.keys(roles).sort()).toEqual(["architect", "client", "consultant", "owner"]);
  });

  for (const [permission, expected] of table) {
    for (const role of ROLE_NAMES) {
      it(`${role} ${expected[role] ? "may" : "may not"} ${JSON.stringify(permission)}`, () => {
        expect(roleCan(role, permission)).toBe(expected[role]);
      });
    }
  }

  it("needs every action of a multi-action permission", () => {
    expect(roleCan("architect", { project: ["readAll", "update"] })).toBe(false);
    expect(roleCan("consultant", { project: ["readAll", "update"] })).toBe(true);
  });

  it("refuses unknown, empty or missing roles", () => {
    expect(roleCan("admin", { project: ["readShared"] })).toBe(false);
    expect(roleCan("member", { project: ["readShared"] })).toBe(false);
    expect(roleCan("", { project: ["readShared"] })).toBe(false);
    expect(roleCan(null, { project: ["readShared"] })).toBe(false);
    expect(roleCan(undefined, { project: ["readShared"] })).toBe(false);
    expect(isRoleName("OWNER")).toBe(false);
  });

  it("grants when any of several comma-separated roles grants", () => {
    expect(roleCan("client,consultant", { project: ["create"] })).toBe(true);
    expect(roleCan("client, architect", { project: ["create"] })).toBe(false);
  });
});
