import { MeResponse } from "@/lib/contracts/auth";
import { endpoint, jsonOf } from "@/lib/server/http";
import { membershipsOf } from "@/lib/server/services/access";

export const GET = endpoint({ auth: "user" }, async ({ user }) =>
  jsonOf(MeResponse, { user: { id: user.id, name: user.name, email: user.email }, memberships: await membershipsOf(user.id) }),
);
