// Outgoing mail: nodemailer over SMTP to the local mail fake (scripts/mail-catcher.ts), never to
// the outside world. SMTP_HOST must be a loopback address.
import nodemailer, { type Transporter } from "nodemailer";
import type Mail from "nodemailer/lib/mailer";

export const DEFAULT_FROM = "Sightward <no-reply@example.org>";

export interface SmtpSettings {
  host: string;
  port: number;
}

const LOOPBACK = /^(127\.\d{1,3}\.\d{1,3}\.\d{1,3}|localhost|::1)$/;

/** SMTP host and port from SMTP_HOST / SMTP_PORT (default 127.0.0.1:2525). */
export function smtpSettings(env: Record<string, string | undefined> = process.env): SmtpSettings {
  const host = env.SMTP_HOST || "127.0.0.1";
  const port = Number(env.SMTP_PORT || 2525);
  if (!LOOPBACK.test(host)) {
    throw new Error(`SMTP_HOST is ${host}; Sightward only sends to the local mail fake on a loopback address such as 127.0.0.1`);
  }
  if (!Number.isInteger(port) || port <= 0 || port > 65535) {
    throw new Error(`SMTP_PORT is ${env.SMTP_PORT}; it must be a port number from 1 to 65535`);
  }
  return { host, port };
}

/** A nodemailer transport to the local fake: plain SMTP, no TLS, no authentication. */
export function createMailTransport(settings: SmtpSettings = smtpSettings()): Transporter {
  return nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 15_000,
  });
}

let shared: { key: string; transport: Transporter } | null = null;

function sharedTransport(): Transporter {
  const settings = smtpSettings();
  const key = `${settings.host}:${settings.port}`;
  if (!shared || shared.key !== key) {
    shared?.transport.close();
    shared = { key, transport: createMailTransport(settings) };
  }
  return shared.transport;
}

export interface SentMail {
  messageId: string;
  accepted: string[];
  rejected: string[];
}

/** Sends one message through the local fake; `from` defaults to Sightward's no-reply address. */
export async function sendMail(message: Mail.Options): Promise<SentMail> {
  const info = await sharedTransport().sendMail({ from: DEFAULT_FROM, ...message });
  const addresses = (list: unknown): string[] =>
    Array.isArray(list) ? list.map((a) => (typeof a === "string" ? a : (a as { address: string }).address)) : [];
  return { messageId: info.messageId, accepted: addresses(info.accepted), rejected: addresses(info.rejected) };
}
