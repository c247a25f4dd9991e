/**
 * Response headers every answer of the server carries: pages, API, auth routes, health, static
 * files and errors alike. scripts/server.mjs sets them before Astro (or its static file handler)
 * answers; astro.config.mjs sets them on the development server. The Content-Security-Policy of
 * pages comes from Astro (astro.config.mjs, experimental.csp), which knows the hashes of the
 * inline scripts it emits.
 */
export const BASE_HEADERS = Object.freeze({
  "x-content-type-options": "nosniff",
  "referrer-policy": "same-origin",
  "cross-origin-opener-policy": "same-origin",
  "permissions-policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=()",
});

/** Sets BASE_HEADERS on a Node.js response that has not been sent yet. */
export function setBaseHeaders(res) {
  for (const [name, value] of Object.entries(BASE_HEADERS)) res.setHeader(name, value);
}
