// Mail goes through lib/mail to the local mail fake that npm test starts (SMTP_PORT, MAIL_DIR),
// and comes back out of MAIL_DIR through the reader the admin mail page uses.
import { describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { listCaughtMail, readCaughtMail, sendMail, smtpSettings } from "@/lib/mail";

function requireMailFake(): void {
  if (!process.env.SMTP_PORT || !process.env.MAIL_DIR) {
    throw new Error("SMTP_PORT and MAIL_DIR are not set: this test needs the mail fake that `npm test` starts");
  }
}

async function waitForMailTo(address: string, timeoutMs = 10_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = await listCaughtMail({ to: address });
    if (found.length > 0 || Date.now() > deadline) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe("mail through the local fake", () => {
  it("sends a message with an iCalendar attachment and reads it back", async () => {
    requireMailFake();
    const recipient = `mail-test-${randomUUID()}@example.org`;
    const calendar = "BEGIN:VCALENDAR\r\nVERSION:2.0\r\nPRODID:-//Sightward//test//EN\r\nEND:VCALENDAR\r\n";
    const sent = await sendMail({
      to: recipient,
      cc: "operations@example.org",
      subject: "Your shifts: week of 22 March — Zeitplan",
      text: "Tuesday 10:00-18:00 Textile Gallery",
      html: "<p>Tuesday 10:00&ndash;18:00 <b>Textile Gallery</b></p>",
      attachments: [{ filename: "shifts.ics", content: calendar, contentType: "text/calendar; charset=utf-8" }],
    });
    expect(sent.accepted).toEqual([recipient, "operations@example.org"]);

    const caught = await waitForMailTo(recipient);
    expect(caught).toHaveLength(1);
    expect(caught[0]).toMatchObject({ subject: "Your shifts: week of 22 March — Zeitplan", attachmentCount: 1 });
    expect(caught[0].to).toEqual([recipient, "operations@example.org"]);

    const mail = await readCaughtMail(caught[0].id);
    expect(mail).not.toBeNull();
    expect(mail!.from).toContain("no-reply@example.org");
    expect(mail!.text.trim()).toBe("Tuesday 10:00-18:00 Textile Gallery");
    expect(mail!.html).toContain("<b>Textile Gallery</b>");
    expect(Number.isNaN(Date.parse(mail!.receivedAt))).toBe(false);
    expect(mail!.attachments).toHaveLength(1);
    expect(mail!.attachments[0]).toMatchObject({ filename: "shifts.ics", size: Buffer.byteLength(calendar) });
    expect(mail!.attachments[0].contentType).toMatch(/^text\/calendar/);
    expect(Buffer.from(mail!.attachments[0].content!, "base64").toString("utf8")).toBe(calendar);
  });

  it("reads nothing for unknown or malformed ids", async () => {
    requireMailFake();
    expect(await readCaughtMail("no-such-message")).toBeNull();
    expect(await readCaughtMail("../../etc/passwd")).toBeNull();
  });

  it("never sends anywhere but a loopback address", () => {
    expect(() => smtpSettings({ SMTP_HOST: "smtp.example.org", SMTP_PORT: "25" })).toThrow(/loopback/);
    expect(smtpSettings({ SMTP_HOST: "127.0.0.1", SMTP_PORT: "2526" })).toEqual({ host: "127.0.0.1", port: 2526 });
  });
});
