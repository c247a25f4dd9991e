import { MeResponse } from "@/lib/contracts/auth";
import { callerOf, endpoint, jsonOf } from "@/lib/server/http";
import { membershipsOf } from "@/lib/server/services/access";

/** The caller and their memberships (with an API key: the key's organisation only, and the key's name and scope). */
export const GET = endpoint({ auth: "user" }, async ({ user, apiKey }) =>
  jsonOf(MeResponse, {
    user: { id: user.id, name: user.name, email: user.email },
    memberships: await membershipsOf(callerOf(user.id, apiKey)),
    ...(apiKey ? { apiKey: { id: apiKey.id, name: apiKey.name, scope: apiKey.scope, organizationId: apiKey.organizationId } } : {}),
  }),
);
