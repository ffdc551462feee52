// The admin's mail page masks what would let a reader act as someone else: set-password tokens and
// personal calendar feed tokens (the feed address is a bearer secret, RFC 6750 style: whoever has
// it reads the calendar). Everything else in the message stays as it was sent.
import { describe, expect, it } from "vitest";
import { maskSecrets, maskedMail } from "@/lib/mail/caught";

describe("masking secrets in caught mail", () => {
  it("masks set-password and calendar tokens, keeping the rest", () => {
    const text = "Choose it here:\n\nhttp://127.0.0.1:3000/set-password?token=Abc_123-xyzXYZ0123456789abcdefghijk\n\nFeed: http://127.0.0.1:3000/api/calendar/0f1e2d3c4b5a69788796a5b4c3d2e1f0 (add it to your calendar)";
    const masked = maskSecrets(text);
    expect(masked).toContain("http://127.0.0.1:3000/set-password?token=••••••");
    expect(masked).toContain("http://127.0.0.1:3000/api/calendar/•••••• (add it to your calendar)");
    expect(masked).not.toMatch(/Abc_123|0f1e2d3c/);
    expect(masked.startsWith("Choose it here:")).toBe(true);
  });

  it("masks the HTML part too and leaves a message without secrets alone", () => {
    const mail = { id: "x", receivedAt: "", from: "a@example.org", to: ["b@example.org"], subject: "s", text: "no links here", html: '<a href="/api/calendar/abcdefgh12345678">feed</a>', attachments: [] };
    const masked = maskedMail(mail);
    expect(masked.text).toBe("no links here");
    expect(masked.html).toBe('<a href="/api/calendar/••••••">feed</a>');
  });
});
