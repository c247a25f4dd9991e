/**
 * Outgoing e-mail over SMTP (nodemailer). SMTP_URL selects the server; `npm start` and
 * `npm test` point it at the local SMTP fake (scripts/smtp-fake.mjs), which stores every
 * message. Without SMTP_URL the message is written to the server log instead, so a
 * deployment without mail still shows invitation and reset links to its operator.
 */
import nodemailer, { type Transporter } from "nodemailer";
import { serverEnv } from "./env";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType?: string }[];
}

let transport: Transporter | null | undefined;

function getTransport(): Transporter | null {
  if (transport === undefined) {
    const url = serverEnv().SMTP_URL;
    if (!url) transport = null;
    else {
      const u = new URL(url);
      const loopback = ["127.0.0.1", "localhost", "[::1]"].includes(u.hostname);
      transport = nodemailer.createTransport({
        host: u.hostname.replace(/^\[|\]$/g, ""),
        port: Number(u.port || (u.protocol === "smtps:" ? 465 : 25)),
        secure: u.protocol === "smtps:",
        // The local fake speaks plain SMTP; real servers negotiate STARTTLS.
        ignoreTLS: loopback,
        // A server that does not answer fails the attempt instead of holding it for minutes (the queue retries).
        connectionTimeout: 10_000,
        greetingTimeout: 10_000,
        socketTimeout: 60_000,
        auth: u.username ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } : undefined,
      });
    }
  }
  return transport;
}

/** Whether SMTP_URL names a server (without one, messages are only logged). */
export const canSendMail = (): boolean => getTransport() !== null;

/** Sends the message; resolves with the Message-ID the SMTP server accepted (null when only logged). */
export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string } | null> {
  const t = getTransport();
  if (!t) {
    console.info(`[mail] SMTP_URL not set; not sent. To: ${mail.to} | ${mail.subject}\n${mail.text}`);
    return null;
  }
  const info = (await t.sendMail({ from: serverEnv().MAIL_FROM, ...mail })) as { messageId?: string };
  return { messageId: info.messageId ?? "" };
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/** A plain message with one call-to-action link, as text and minimal HTML. */
export function actionMail(opts: { to: string; subject: string; lines: string[]; actionLabel: string; url: string }): OutgoingMail {
  const text = [...opts.lines, "", `${opts.actionLabel}: ${opts.url}`, "", "— Paneray"].join("\n");
  const html =
    `<div style="font-family:Lato,Arial,sans-serif;font-size:15px;color:#1d2a33">` +
    opts.lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("") +
    `<p><a href="${escapeHtml(opts.url)}" style="background:#0f4c5c;color:#fff;padding:8px 14px;border-radius:4px;text-decoration:none">${escapeHtml(opts.actionLabel)}</a></p>` +
    `<p style="color:#667">Or paste this address into your browser: ${escapeHtml(opts.url)}</p><p>— Paneray</p></div>`;
  return { to: opts.to, subject: opts.subject, text, html };
}
