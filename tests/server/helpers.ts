import { signUp } from "@/lib/server/services/accounts";

let n = 0;
/** A unique address per call (tests share one throwaway database). */
export const uniqueEmail = (tag: string) => `${tag}-${Date.now().toString(36)}-${++n}@test.example`;

/** Request headers carrying the session cookie that better-auth set. */
export function cookieHeaders(setCookie: Headers): Headers {
  const cookie = setCookie
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return new Headers({ cookie, origin: process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:4321" });
}

export async function newOwner(tag = "owner") {
  const email = uniqueEmail(tag);
  const r = await signUp({ name: `Test ${tag}`, email, password: "correct horse", organizationName: `Firm ${tag} ${n}` });
  return { ...r, email, headers: cookieHeaders(r.headers) };
}
