// @ts-check
import { defineConfig } from "astro/config";
import node from "@astrojs/node";
import react from "@astrojs/react";
import tailwindcss from "@tailwindcss/vite";

/** Extra host names the server answers for (comma-separated), e.g. a production domain. */
const extraHosts = (process.env.PANERAY_HOSTS ?? "")
  .split(",")
  .map((h) => h.trim())
  .filter(Boolean)
  .map((hostname) => ({ hostname }));

export default defineConfig({
  output: "server",
  adapter: node({ mode: "standalone" }),
  integrations: [react()],
  security: {
    // Without this the node adapter distrusts the Host header: request.url becomes
    // http://localhost/… and same-origin form posts are refused.
    allowedDomains: [{ hostname: "127.0.0.1" }, { hostname: "localhost" }, ...extraHosts],
  },
  vite: { plugins: [tailwindcss()] },
});
