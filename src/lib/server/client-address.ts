/**
 * The address of the client that sent a request, for rate limits and session records.
 *
 * Astro's `clientAddress` takes the first X-Forwarded-For value, which any caller can set, so it is not used.
 * The socket's own address is recorded for every HTTP request this process serves (node's `request` event runs
 * inside an AsyncLocalStorage holding it), and forwarding headers count only when that socket address belongs to
 * a proxy listed in TRUSTED_PROXIES.
 */
import { AsyncLocalStorage } from "node:async_hooks";
import http from "node:http";
import https from "node:https";
import { BlockList, isIP } from "node:net";
import { serverEnv } from "./env";

const socketAddressStore = new AsyncLocalStorage<string | null>();
const PATCHED = Symbol.for("paneray.socketAddressPatched");

function recordSocketAddresses(proto: { emit: (event: string | symbol, ...args: unknown[]) => boolean } & Record<symbol, unknown>) {
  if (proto[PATCHED]) return;
  const emit = proto.emit;
  proto.emit = function (this: unknown, event: string | symbol, ...args: unknown[]) {
    if (event === "request") {
      const req = args[0] as http.IncomingMessage;
      return socketAddressStore.run(req.socket?.remoteAddress ?? null, () => emit.call(this, event, ...args));
    }
    return emit.call(this, event, ...args);
  };
  proto[PATCHED] = true;
}
recordSocketAddresses(http.Server.prototype as never);
recordSocketAddresses(https.Server.prototype as never);

/** The socket address of the HTTP request being served, or undefined outside one (or before this module loaded). */
export function currentSocketAddress(): string | undefined {
  return socketAddressStore.getStore() ?? undefined;
}

/** "::ffff:192.0.2.1" → "192.0.2.1"; brackets and ports of Forwarded values removed; undefined if not an IP. */
export function normaliseAddress(raw: string | undefined | null): string | undefined {
  if (!raw) return undefined;
  let a = raw.trim().replace(/^"|"$/g, "");
  const bracketed = /^\[([^\]]+)\](?::\d+)?$/.exec(a);
  if (bracketed) a = bracketed[1]!;
  else if (/^\d{1,3}(\.\d{1,3}){3}:\d+$/.test(a)) a = a.slice(0, a.lastIndexOf(":"));
  const mapped = /^::ffff:(\d{1,3}(\.\d{1,3}){3})$/i.exec(a);
  if (mapped) a = mapped[1]!;
  return isIP(a) ? a.toLowerCase() : undefined;
}

/** Parses "10.0.0.0/8, 192.0.2.7, ::1" into a block list; throws naming the entry that is not an address or block. */
export function parseTrustedProxies(list: string): BlockList {
  const blocks = new BlockList();
  for (const entry of list
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean)) {
    const [addr, bits] = entry.split("/");
    const ip = normaliseAddress(addr);
    const family = ip ? (isIP(ip) === 6 ? "ipv6" : "ipv4") : undefined;
    const prefix = bits === undefined ? undefined : Number(bits);
    if (!ip || !family || (prefix !== undefined && !(Number.isInteger(prefix) && prefix >= 0 && prefix <= (family === "ipv6" ? 128 : 32)))) {
      throw new Error(`TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR block`);
    }
    if (prefix === undefined) blocks.addAddress(ip, family);
    else blocks.addSubnet(ip, prefix, family);
  }
  return blocks;
}

const isTrusted = (ip: string, proxies: BlockList) => proxies.check(ip, isIP(ip) === 6 ? "ipv6" : "ipv4");

/** The addresses a request passed through, nearest last: X-Forwarded-For, else the `for=` values of Forwarded. */
function forwardedChain(headers: Headers): string[] {
  const xff = headers.get("x-forwarded-for");
  if (xff) return xff.split(",").map((s) => s.trim());
  const fwd = headers.get("forwarded");
  if (fwd) {
    return fwd
      .split(",")
      .map((part) => /(?:^|;)\s*for=("[^"]*"|[^;,\s]*)/i.exec(part)?.[1] ?? "")
      .map((s) => s.trim());
  }
  return [];
}

/**
 * The client's address: the socket's, unless the socket is a trusted proxy; then the nearest address in the
 * forwarding chain that is not itself a trusted proxy. An entry that is not an IP address ends the walk (the
 * last trusted hop is answered instead), so a malformed header cannot pick the address.
 */
export function resolveClientAddress(socketAddress: string, headers: Headers, proxies: BlockList): string {
  let client = normaliseAddress(socketAddress) ?? socketAddress;
  if (!isTrusted(client, proxies)) return client;
  const chain = forwardedChain(headers);
  for (let i = chain.length - 1; i >= 0; i--) {
    const hop = normaliseAddress(chain[i]);
    if (!hop) break;
    client = hop;
    if (!isTrusted(hop, proxies)) break;
  }
  return client;
}

let configured: BlockList | undefined;
const configuredProxies = () => (configured ??= parseTrustedProxies(serverEnv().TRUSTED_PROXIES));

/** Stands for the client when no socket address is known and the request carries forwarding headers. */
export const UNKNOWN_CLIENT = "unknown";

/**
 * The client address of the request being served. `fallback` (Astro's clientAddress) is used only when no socket
 * address was recorded and the request carries no forwarding header (then Astro's value is the socket's).
 */
export function clientAddressOf(request: Request, fallback?: string): string {
  const socket = currentSocketAddress();
  if (socket) return resolveClientAddress(socket, request.headers, configuredProxies());
  if (fallback && !request.headers.has("x-forwarded-for") && !request.headers.has("forwarded")) return normaliseAddress(fallback) ?? fallback;
  return UNKNOWN_CLIENT;
}
