/**
 * A local fake SMTP server (the smtp-server package) for development and tests: accepts every message on
 * 127.0.0.1 and appends it, parsed to { to, subject, text }, as one JSON line to the capture file.
 * Usage: tsx scripts/mail-fake.ts [port] [captureFile]
 */
import { appendFileSync, mkdirSync } from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

const port = Number(process.argv[2] ?? process.env.SMTP_PORT ?? 2525);
const file = process.argv[3] ?? process.env.MAIL_CAPTURE_FILE ?? ".data/mail/captured.jsonl";
mkdirSync(path.dirname(file), { recursive: true });

const server = new SMTPServer({
  secure: false,
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", async () => {
      const raw = Buffer.concat(chunks);
      const to = session.envelope.rcptTo.map((r) => r.address);
      try {
        const mail = await simpleParser(raw);
        const entry = {
          receivedAt: new Date().toISOString(),
          to,
          subject: mail.subject ?? "",
          text: (mail.text ?? "").slice(0, 100_000),
          html: typeof mail.html === "string" ? mail.html.slice(0, 100_000) : "",
        };
        appendFileSync(file, JSON.stringify(entry) + "\n");
        callback();
      } catch (err) {
        callback(err as Error);
      }
    });
  },
});
server.listen(port, "127.0.0.1", () => console.error(`[mail] fake SMTP on 127.0.0.1:${port}, capturing to ${file}`));
const stop = () => server.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
