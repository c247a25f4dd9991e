/**
 * The production server: Astro's built handler (static files from dist/client, then the app) behind
 * a Node.js HTTP server of ours that first sets the headers every response carries
 * (scripts/security-headers.mjs). Astro's own middleware never sees requests for static files, so
 * this is the one place that reaches all of them.
 *
 *   node scripts/server.mjs        (after `astro build`; HOST and PORT as for the adapter, default 127.0.0.1:4321)
 */
import { readFileSync } from "node:fs";
import http from "node:http";
import https from "node:https";
import { setBaseHeaders } from "./security-headers.mjs";

// The adapter's entry starts a server of its own on import unless told not to.
process.env.ASTRO_NODE_AUTOSTART = "disabled";
const { handler } = await import(new URL("../dist/server/entry.mjs", import.meta.url).href);

const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 4321);

const listener = (req, res) => {
  setBaseHeaders(res);
  handler(req, res);
};
// TLS as with the adapter's own server: SERVER_CERT_PATH and SERVER_KEY_PATH (PEM files).
const tls = process.env.SERVER_CERT_PATH && process.env.SERVER_KEY_PATH;
const server = tls
  ? https.createServer({ cert: readFileSync(process.env.SERVER_CERT_PATH), key: readFileSync(process.env.SERVER_KEY_PATH) }, listener)
  : http.createServer(listener);

server.on("error", (err) => {
  console.error(`[server] ${err.message}`);
  process.exit(1);
});
server.listen(port, host, () => {
  const address = server.address();
  const shown =
    typeof address === "object" && address
      ? `${address.family === "IPv6" ? `[${address.address}]` : address.address}:${address.port}`
      : String(address);
  console.log(`[server] listening on ${tls ? "https" : "http"}://${shown}`);
});

const stop = () => {
  server.close(() => process.exit(0));
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 5000).unref();
};
process.once("SIGTERM", stop);
process.once("SIGINT", stop);
