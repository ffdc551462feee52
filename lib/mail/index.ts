// Mail: send through the local fake, read what it caught.
export { sendMail, createMailTransport, smtpSettings, DEFAULT_FROM } from "./transport";
export type { SmtpSettings, SentMail } from "./transport";
export { listCaughtMail, readCaughtMail, mailDir, isCaughtMailId } from "./caught";
export type { CaughtMail, CaughtMailSummary, CaughtAttachment } from "./caught";
