// The iCalendar writer against the rules of RFC 5545 (Internet Calendaring and Scheduling Core
// Object Specification, IETF 2009): §3.1 content lines (CRLF, folding at 75 octets, unfolding),
// §3.3.5 DATE-TIME in UTC, §3.3.11 TEXT escaping, §3.4/§3.6/§3.6.1/§3.7 required properties.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { calendarText, escapeText, foldLine, utcDateTime, type CalendarEvent } from "@/lib/calendar/ics";

const octets = (text: string) => new TextEncoder().encode(text).length;

/** RFC 5545 §3.1: unfolding removes every CRLF immediately followed by one space or tab. */
function unfold(text: string): string {
  return text.replace(/\r\n[ \t]/g, "");
}

/** RFC 5545 §3.3.11, read in reverse: the original text of an escaped TEXT value. */
function unescapeText(value: string): string {
  return value.replace(/\\([\\;,nN])/g, (_, c: string) => (c === "n" || c === "N" ? "\n" : c));
}

function event(overrides: Partial<CalendarEvent> = {}): CalendarEvent {
  return {
    uid: "shift-7-2027-03-23T09:00:00.000Z@sightward.example.org",
    start: new Date("2027-03-23T09:00:00Z"),
    end: new Date("2027-03-23T17:00:00Z"),
    summary: "Shift: Textile Gallery · post 1",
    ...overrides,
  };
}

describe("content lines (RFC 5545 §3.1)", () => {
  it("ends every line with CRLF and has no bare LF or CR", () => {
    const text = calendarText([event({ description: "line one\nline two\r\nline three" })]);
    expect(text.endsWith("\r\n")).toBe(true);
    expect(text.replace(/\r\n/g, "")).not.toMatch(/[\r\n]/);
  });

  it("keeps every physical line within 75 octets, continuation lines starting with one space", () => {
    const long = "Textile Gallery · post 12 — Großer Saal, Vitrinen; Ausgang frei halten. ".repeat(6);
    const text = calendarText([event({ description: long, summary: long })], { name: long });
    const lines = text.split("\r\n").slice(0, -1);
    for (const line of lines) expect(octets(line), line).toBeLessThanOrEqual(75);
    expect(lines.some((line) => line.startsWith(" "))).toBe(true);
  });

  it("unfolds back to the original line, never splitting a UTF-8 character (property)", () => {
    fc.assert(
      fc.property(fc.string({ unit: "grapheme", maxLength: 400 }), (value) => {
        const line = `DESCRIPTION:${value}`;
        const folded = foldLine(line);
        for (const physical of folded.split("\r\n")) {
          expect(octets(physical)).toBeLessThanOrEqual(75);
          // A split inside a multi-octet character would leave a replacement character on decoding.
          expect(new TextDecoder("utf-8", { fatal: true }).decode(new TextEncoder().encode(physical))).toBe(physical);
        }
        expect(unfold(folded)).toBe(line);
      }),
      { numRuns: 300 },
    );
  });

  it("leaves a line of exactly 75 octets alone and folds one of 76", () => {
    const exact = "X".repeat(75);
    expect(foldLine(exact)).toBe(exact);
    const over = "X".repeat(76);
    expect(foldLine(over)).toBe(`${"X".repeat(75)}\r\n X`);
  });
});

describe("TEXT escaping (RFC 5545 §3.3.11)", () => {
  it("escapes backslash, semicolon, comma and line breaks", () => {
    expect(escapeText("a\\b;c,d\ne")).toBe("a\\\\b\\;c\\,d\\ne");
    expect(escapeText("x\r\ny")).toBe("x\\ny");
  });

  it("does not escape a colon or double quote, which TEXT allows", () => {
    expect(escapeText('10:00 "Hall"')).toBe('10:00 "Hall"');
  });

  it("round-trips any text through escaping (property)", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 200 }), (value) => {
        const clean = value.replace(/[\u0000-\u0008\u000b-\u001f\u007f]/g, "").replace(/\r\n|\r/g, "\n");
        const escaped = escapeText(value);
        // An unescaped ; or , would end the value or split it into a list (§3.1, §3.3.11).
        expect(escaped.replace(/\\\\|\\;|\\,|\\n/g, "")).not.toMatch(/[;,\n\r]/);
        expect(unescapeText(escaped)).toBe(clean);
      }),
      { numRuns: 300 },
    );
  });
});

describe("calendar structure", () => {
  const text = calendarText(
    [event(), event({ uid: "second@sightward.example.org", start: new Date("2027-03-24T12:30:00Z"), end: new Date("2027-03-24T20:30:00Z"), sequence: 2 })],
    { name: "Mara Lindqvist: shifts", timeZone: "Europe/Berlin", method: "PUBLISH", stamp: new Date("2027-03-20T08:15:30.250Z") },
  );
  const lines = unfold(text).split("\r\n").slice(0, -1);

  it("wraps everything in one VCALENDAR with VERSION:2.0 and a PRODID (§3.4, §3.6, §3.7.3, §3.7.4)", () => {
    expect(lines[0]).toBe("BEGIN:VCALENDAR");
    expect(lines.at(-1)).toBe("END:VCALENDAR");
    expect(lines.filter((l) => l === "VERSION:2.0")).toHaveLength(1);
    expect(lines.filter((l) => l.startsWith("PRODID:"))).toHaveLength(1);
    expect(lines).toContain("METHOD:PUBLISH");
  });

  it("gives every VEVENT exactly one UID, DTSTAMP and DTSTART, and a DTEND after DTSTART (§3.6.1)", () => {
    const events: string[][] = [];
    let current: string[] | null = null;
    for (const line of lines) {
      if (line === "BEGIN:VEVENT") current = [];
      else if (line === "END:VEVENT") {
        events.push(current!);
        current = null;
      } else current?.push(line);
    }
    expect(events).toHaveLength(2);
    for (const properties of events) {
      for (const name of ["UID", "DTSTAMP", "DTSTART", "DTEND"]) {
        expect(properties.filter((p) => p.startsWith(`${name}:`)), name).toHaveLength(1);
      }
      const value = (name: string) => properties.find((p) => p.startsWith(`${name}:`))!.slice(name.length + 1);
      // §3.3.5 form #2: UTC time, "Z" suffix, no fractional seconds.
      for (const name of ["DTSTAMP", "DTSTART", "DTEND"]) expect(value(name)).toMatch(/^\d{8}T\d{6}Z$/);
      expect(value("DTEND") > value("DTSTART")).toBe(true);
    }
    expect(events[0]).toContain("DTSTART:20270323T090000Z");
    expect(events[0]).toContain("DTSTAMP:20270320T081530Z");
    expect(events[1]).toContain("SEQUENCE:2");
  });

  it("names properties in upper case, each line NAME:VALUE (§3.1 contentline)", () => {
    for (const line of lines) expect(line).toMatch(/^[A-Z][A-Z0-9-]*(;[^:]*)?:/);
  });

  it("refuses an event that ends before it starts", () => {
    expect(() => calendarText([event({ end: new Date("2027-03-23T08:00:00Z") })])).toThrow(/ends .* before it starts/);
  });

  it("writes UTC date-times as the RFC's example does (§3.3.5: 19980119T070000Z)", () => {
    expect(utcDateTime(new Date(Date.UTC(1998, 0, 19, 7, 0, 0)))).toBe("19980119T070000Z");
  });
});
