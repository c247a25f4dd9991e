import { openApiDocument } from "@/lib/api-docs/openapi";
import { endpoint } from "@/lib/server/http";

let body: string | undefined;

/** The OpenAPI 3.1 document of /api/v1 (public), built once per process. */
export const GET = endpoint({ auth: "anonymous" }, () => {
  body ??= JSON.stringify(openApiDocument());
  return new Response(body, {
    status: 200,
    headers: { "content-type": "application/json; charset=utf-8", "cache-control": "public, max-age=300" },
  });
});
