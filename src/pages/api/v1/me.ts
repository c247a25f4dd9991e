import { endpoint, json, requireUser } from "@/lib/server/http";
import { membershipsOf } from "@/lib/server/services/access";

export const prerender = false;

export const GET = endpoint(async ({ locals }) => {
  const user = requireUser(locals);
  return json({ user: { id: user.id, name: user.name, email: user.email }, memberships: await membershipsOf(user.id) });
});
