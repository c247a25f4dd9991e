// Local SMTP fake for development and tests: accepts every message on 127.0.0.1:$SMTP_PORT and
// stores it, as sent, in $MAIL_DIR/<time>-<n>.eml. It logs one line per message with the first link.
import { SMTPServer } from "smtp-server";
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";

const dir = process.env.MAIL_DIR ?? ".data/mail";
const port = Number(process.env.SMTP_PORT ?? 2525);
mkdirSync(dir, { recursive: true });
let n = 0;

/** Decodes RFC 2047 encoded words (=?UTF-8?Q?…?= / =?UTF-8?B?…?=) for the log line. */
const decodeWords = (s) =>
  s.replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=\s*/g, (_, _cs, enc, data) =>
    enc.toUpperCase() === "B"
      ? Buffer.from(data, "base64").toString("utf8")
      : Buffer.from(
          data.replace(/_/g, " ").replace(/=([0-9A-F]{2})/gi, (_m, h) => String.fromCharCode(parseInt(h, 16))),
          "latin1",
        ).toString("utf8"),
  );

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "Paneray local SMTP fake",
  size: 25 * 1024 * 1024,
  onData(stream, session, done) {
    const chunks = [];
    stream.on("data", (c) => chunks.push(c));
    stream.on("end", () => {
      const raw = Buffer.concat(chunks);
      const file = join(dir, `${new Date().toISOString().replace(/[:.]/g, "-")}-${String(++n).padStart(4, "0")}.eml`);
      writeFileSync(file, raw);
      const text = raw.toString("utf8");
      const subject = decodeWords((/^Subject: (.*(?:\r?\n[ \t].*)*)/m.exec(text)?.[1] ?? "").replace(/\r?\n[ \t]/g, " "));
      const link = (/https?:\/\/[^\s"<>]+/.exec(text.replace(/=\r?\n/g, ""))?.[0] ?? "").replace(/=3D/g, "=");
      const to = session.envelope.rcptTo.map((r) => r.address).join(", ");
      console.log(`[mail] to ${to}: ${subject}${link ? `\n[mail]   ${link}` : ""}`);
      done();
    });
  },
});
server.on("error", (err) => console.error("[mail] SMTP fake error:", err.message));
server.listen(port, "127.0.0.1");
const stop = () => server.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
