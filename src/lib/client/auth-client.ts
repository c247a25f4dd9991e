import { createAuthClient } from "better-auth/react";
import { organizationClient } from "better-auth/client/plugins";
import { ac, roles } from "@/lib/auth/roles";

/** better-auth's browser client (same origin as the page). */
export const authClient = createAuthClient({
  plugins: [organizationClient({ ac, roles })],
});
