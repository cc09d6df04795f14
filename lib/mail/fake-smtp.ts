/**
 * A local SMTP fake for the demo: accepts every message on 127.0.0.1:2525 (SMTP_FAKE_PORT) and
 * stores it under .data/mail as <time>-<pid>-<n>-<subject>.eml plus a .json summary, so e-mail can be read
 * without a mail server. Loopback only, no TLS, no auth: never for production.
 *   npx tsx lib/mail/fake-smtp.ts
 */
import { env } from "@/lib/env";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const dir = path.resolve(env.MAIL_DIR);
const port = env.SMTP_FAKE_PORT;
mkdirSync(dir, { recursive: true });
let seq = 0;

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  size: 10 * 1024 * 1024,
  onData(stream, _session, done) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", () => {
      const raw = Buffer.concat(chunks);
      simpleParser(raw)
        .then((m) => {
          const slug = (m.subject ?? "no-subject")
            .replace(/[^a-z0-9]+/gi, "-")
            .slice(0, 60)
            .toLowerCase();
          // A sequence number and the process id keep two messages of the same millisecond apart.
          const base = `${new Date().toISOString().replace(/[:.]/g, "-")}-${process.pid}-${String(++seq).padStart(6, "0")}-${slug}`;
          writeFileSync(path.join(dir, `${base}.eml`), raw);
          const to = Array.isArray(m.to) ? m.to.map((a) => a.text).join(", ") : (m.to?.text ?? "");
          writeFileSync(
            path.join(dir, `${base}.json`),
            JSON.stringify(
              { to, from: m.from?.text, subject: m.subject, date: m.date, text: m.text },
              null,
              2,
            ),
          );
          console.log(`fake-smtp: ${to} — ${m.subject}`);
          done();
        })
        .catch(done);
    });
  },
});

server.listen(port, "127.0.0.1", () =>
  console.log(`fake-smtp: listening on 127.0.0.1:${port}, storing mail in ${dir}`),
);
for (const sig of ["SIGINT", "SIGTERM"] as const) process.on(sig, () => server.close(() => process.exit(0)));
