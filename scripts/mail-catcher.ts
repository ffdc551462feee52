// The local mail fake: an SMTP server on 127.0.0.1:SMTP_PORT (default 2525) that accepts every
// message and writes it to MAIL_DIR (default .data/mail) as <id>.json. Nothing is relayed.
// Run: npx tsx scripts/mail-catcher.ts  (npm start and npm test start it for you)
import { promises as fs } from "node:fs";
import path from "node:path";
import { randomBytes } from "node:crypto";
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import type { CaughtMail } from "../lib/mail/caught";

const host = process.env.SMTP_HOST || "127.0.0.1";
const port = Number(process.env.SMTP_PORT || 2525);
const folder = path.resolve(process.env.MAIL_DIR || path.join(".data", "mail"));
const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;
const MAX_KEPT_ATTACHMENT_BYTES = 1024 * 1024;

function log(message: string): void {
  console.log(`${new Date().toISOString()} mail-catcher: ${message}`);
}

// Sortable by arrival, unique within a run and across runs.
function newId(): string {
  return `${Date.now().toString(36).padStart(9, "0")}-${randomBytes(4).toString("hex")}`;
}

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return "";
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(", ");
}

await fs.mkdir(folder, { recursive: true });

const server = new SMTPServer({
  name: "sightward-mail-fake",
  banner: "Sightward local mail fake: messages are stored, never delivered",
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  size: MAX_MESSAGE_BYTES,
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then(async (parsed) => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          throw Object.assign(new Error("message exceeds the 25 MB limit"), { responseCode: 552 });
        }
        const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
        const mail: CaughtMail = {
          id: newId(),
          receivedAt: new Date().toISOString(),
          from: addressText(parsed.from) || envelopeFrom,
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
          attachments: parsed.attachments.map((a) => ({
            filename: a.filename ?? null,
            contentType: a.contentType,
            size: a.size,
            content: a.size <= MAX_KEPT_ATTACHMENT_BYTES ? a.content.toString("base64") : null,
          })),
        };
        // Write then rename, so a reader never sees half a message.
        const file = path.join(folder, `${mail.id}.json`);
        await fs.writeFile(`${file}.tmp`, JSON.stringify(mail, null, 2));
        await fs.rename(`${file}.tmp`, file);
        log(`caught ${mail.id} to ${mail.to.join(", ")}: ${mail.subject}`);
        callback(null, `stored as ${mail.id}`);
      })
      .catch((error: Error) => {
        log(`could not store a message: ${error.message}`);
        callback(error);
      });
  },
});

server.on("error", (error: NodeJS.ErrnoException) => {
  if (error.code === "EADDRINUSE") {
    log(`port ${port} is already in use; set SMTP_PORT to another port`);
    process.exit(1);
  }
  log(`error: ${error.message}`);
});

server.listen(port, host, () => log(`listening on ${host}:${port}, writing to ${folder}`));

function shutdown(signal: string): void {
  log(`${signal}: closing`);
  server.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 3000).unref();
}
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));
