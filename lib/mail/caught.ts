// Reads the messages the local mail fake (scripts/mail-catcher.ts) caught: one JSON file per
// message in MAIL_DIR. Used by the admin mail page and by tests.
import { promises as fs } from "node:fs";
import path from "node:path";
import { maskSecrets } from "./mask";

export { maskSecrets };

export interface CaughtAttachment {
  filename: string | null;
  contentType: string;
  size: number;
  /** The attachment's bytes as base64 (kept for attachments up to 1 MB, else null). */
  content?: string | null;
}

/** One caught message, as stored in MAIL_DIR/<id>.json. */
export interface CaughtMail {
  id: string;
  /** ISO timestamp of arrival at the fake. */
  receivedAt: string;
  from: string;
  /** Envelope recipients (To, Cc and Bcc alike). */
  to: string[];
  subject: string;
  text: string;
  html: string;
  attachments: CaughtAttachment[];
}

export interface CaughtMailSummary {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  attachmentCount: number;
}

const ID_PATTERN = /^[A-Za-z0-9_-]{1,100}$/;

/** The folder the fake writes to (MAIL_DIR, default .data/mail under the working folder). */
export function mailDir(): string {
  // The ignore comments keep Next.js from tracing the whole project into the server bundle.
  return path.resolve(/*turbopackIgnore: true*/ process.env.MAIL_DIR || path.join(".data", "mail"));
}

export function isCaughtMailId(id: string): boolean {
  return ID_PATTERN.test(id);
}

async function readMessageFile(file: string): Promise<CaughtMail | null> {
  try {
    return JSON.parse(await fs.readFile(/*turbopackIgnore: true*/ file, "utf8")) as CaughtMail;
  } catch {
    // A file removed or being replaced between listing and reading: treat as absent.
    return null;
  }
}

/**
 * Caught messages, newest first. `to` keeps only messages to that address (case-insensitive);
 * `limit` caps the count. An absent MAIL_DIR means no mail yet.
 */
export async function listCaughtMail(options: { to?: string; limit?: number } = {}): Promise<CaughtMailSummary[]> {
  const folder = mailDir();
  let names: string[];
  try {
    names = await fs.readdir(/*turbopackIgnore: true*/ folder);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return [];
    throw error;
  }
  const wanted = options.to?.toLowerCase();
  const messages = await Promise.all(
    names
      .filter((name) => name.endsWith(".json") && isCaughtMailId(name.slice(0, -5)))
      .map((name) => readMessageFile(path.join(/*turbopackIgnore: true*/ folder, name))),
  );
  const summaries = messages
    .filter((mail): mail is CaughtMail => mail !== null)
    .filter((mail) => !wanted || mail.to.some((address) => address.toLowerCase() === wanted))
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id))
    .map((mail) => ({
      id: mail.id,
      receivedAt: mail.receivedAt,
      from: mail.from,
      to: mail.to,
      subject: mail.subject,
      attachmentCount: mail.attachments.length,
    }));
  return options.limit === undefined ? summaries : summaries.slice(0, options.limit);
}

/** One caught message by id, or null when there is none (or the id is malformed). */
export async function readCaughtMail(id: string): Promise<CaughtMail | null> {
  if (!isCaughtMailId(id)) return null;
  return readMessageFile(path.join(/*turbopackIgnore: true*/ mailDir(), `${id}.json`));
}

/** A caught message as the admin's mail page shows it: text, HTML and attachments' names with secrets masked. */
export function maskedMail(message: CaughtMail): CaughtMail {
  return { ...message, text: maskSecrets(message.text), html: maskSecrets(message.html) };
}
