/**
 * Server configuration, read from the process environment at run time and checked once. This is the
 * only module in src that reads `process.env`.
 * (Read here rather than through astro:env so that scripts run outside Astro, such as the
 * demo seed, share exactly the same configuration.)
 */
import { z } from "zod";

/** The worker pool of the heavy calculations (read on its own too: the pool needs no database). */
const CalcEnv = z.object({
  /** Worker threads for the schedule and glazing calculations; unset: cores − 1 (at least 1); 0: on the main thread. */
  CALC_WORKERS: z.coerce.number().int("CALC_WORKERS must be a whole number").min(0).max(64).optional(),
  /** Calculations that may wait for a free worker; past it the answer is 503 with Retry-After. */
  CALC_QUEUE_LIMIT: z.coerce.number().int("CALC_QUEUE_LIMIT must be a whole number").min(0).max(10_000).default(16),
});

const Env = z.object({
  ...CalcEnv.shape,
  DATABASE_URL: z.string().min(1, "DATABASE_URL is required (postgres://…)"),
  BETTER_AUTH_URL: z.url().default("http://127.0.0.1:4321"),
  BETTER_AUTH_SECRET: z.string().min(32).optional(),
  /** Extra browser origins allowed to call the auth endpoints (comma-separated). */
  TRUSTED_ORIGINS: z.string().default(""),
  /** smtp://host:port — where outgoing mail goes. Unset: mail is logged, not sent. */
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default("Paneray <no-reply@paneray.invalid>"),
  /** "off" switches better-auth's per-client rate limits off (the browser tests sign in often); anything else keeps them. */
  AUTH_RATE_LIMIT: z.string().default("on"),
  /**
   * Reverse proxies whose X-Forwarded-For / Forwarded headers are believed (comma-separated IP addresses or
   * CIDR blocks, e.g. "10.0.0.0/8, ::1"). Default none: the client address is the socket's.
   */
  TRUSTED_PROXIES: z.string().default(""),
  /** "off": this web server runs no job worker (run `npm run worker` beside it); anything else runs one inside it. */
  WORKER: z.string().default("on"),
  /** E-mail deliveries an organisation may start per hour (429 with Retry-After past it). */
  DELIVERY_RATE_LIMIT: z.coerce.number().int("DELIVERY_RATE_LIMIT must be a whole number").min(1).max(100_000).default(30),
  /** Requests one API key may make per minute (429 with Retry-After past it), counted in PostgreSQL. */
  API_KEY_RATE_LIMIT: z.coerce.number().int("API_KEY_RATE_LIMIT must be a whole number").min(1).max(1_000_000).default(600),
  /** Retries of a delivery whose sending failed, after the first attempt. */
  DELIVERY_RETRY_LIMIT: z.coerce.number().int("DELIVERY_RETRY_LIMIT must be a whole number").min(0).max(50).default(5),
  /** Seconds before the first retry; later ones wait about twice as long each time (with jitter). */
  DELIVERY_RETRY_DELAY_SECONDS: z.coerce.number().int("DELIVERY_RETRY_DELAY_SECONDS must be a whole number").min(1).max(3600).default(20),
  /** How often an idle worker looks for new jobs, in seconds. */
  JOB_POLL_SECONDS: z.coerce.number().min(0.5, "JOB_POLL_SECONDS must be at least 0.5").max(60).default(2),
});

export type ServerEnv = z.infer<typeof Env>;

let cached: ServerEnv | undefined;

export function serverEnv(): ServerEnv {
  if (!cached) {
    const parsed = Env.safeParse(process.env);
    if (!parsed.success) {
      const msg = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
      throw new Error(`Paneray configuration error: ${msg}`);
    }
    cached = parsed.data;
  }
  return cached;
}

let cachedCalc: z.infer<typeof CalcEnv> | undefined;

/** CALC_WORKERS and CALC_QUEUE_LIMIT, checked (they are also part of serverEnv()). */
export function calcEnv(): z.infer<typeof CalcEnv> {
  if (!cachedCalc) {
    const parsed = CalcEnv.safeParse(process.env);
    if (!parsed.success) {
      const msg = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
      throw new Error(`Paneray configuration error: ${msg}`);
    }
    cachedCalc = parsed.data;
  }
  return cachedCalc;
}
