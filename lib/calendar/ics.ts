// A small iCalendar writer (RFC 5545) for shift calendars: VCALENDAR with VEVENTs, times in UTC
// (RFC 5545 §3.3.5 form #2, so no VTIMEZONE is needed and every client shows its own local time),
// TEXT escaped (§3.3.11), lines ended by CRLF and folded at 75 octets (§3.1).

export interface CalendarEvent {
  /** Globally unique and stable across versions of the same event (§3.8.4.7). */
  uid: string;
  start: Date;
  end: Date;
  summary: string;
  description?: string;
  location?: string;
  /** Revision of the event (§3.8.7.4); bump when it changes so clients replace their copy. */
  sequence?: number;
}

export interface CalendarOptions {
  /** Identifies the product that made the calendar (§3.7.3). */
  productId?: string;
  /** Display name, as the widely read X-WR-CALNAME extension. */
  name?: string;
  /** The site's IANA zone, as the X-WR-TIMEZONE extension (times themselves are UTC). */
  timeZone?: string;
  /** PUBLISH for a feed or attachment with no reply expected (RFC 5546 §1.4). */
  method?: "PUBLISH";
  /** DTSTAMP of every event: when this calendar was written (§3.8.7.2). */
  stamp?: Date;
}

export const SIGHTWARD_PRODUCT_ID = "-//Sightward//Rosters//EN";

/** Escapes a TEXT value: backslash, semicolon, comma and line breaks (§3.3.11). */
export function escapeText(value: string): string {
  return value
    .replace(/\\/g, "\\\\")
    .replace(/;/g, "\\;")
    .replace(/,/g, "\\,")
    .replace(/\r\n|\r|\n/g, "\\n")
    // Other control characters are not allowed in TEXT (§3.3.11 ESCAPED-CHAR / TSAFE-CHAR).
    .replace(/[\u0000-\u0008\u000b-\u001f\u007f]/g, "");
}

/** A UTC DATE-TIME: 20270323T090000Z (§3.3.5, form #2). */
export function utcDateTime(instant: Date): string {
  if (Number.isNaN(instant.getTime())) throw new Error("an event time is not a valid date");
  return instant.toISOString().replace(/[-:]/g, "").replace(/\.\d{3}/, "");
}

const encoder = new TextEncoder();

/**
 * Folds one content line so no physical line exceeds 75 octets (CRLF excluded): the rest goes on
 * continuation lines starting with one space (§3.1). Never splits a UTF-8 character.
 */
export function foldLine(line: string): string {
  if (encoder.encode(line).length <= 75) return line;
  const pieces: string[] = [];
  let current = "";
  let currentOctets = 0;
  let limit = 75;
  for (const character of line) {
    const octets = encoder.encode(character).length;
    if (currentOctets + octets > limit) {
      pieces.push(current);
      current = "";
      currentOctets = 0;
      // A continuation line's leading space counts towards its 75 octets.
      limit = 74;
    }
    current += character;
    currentOctets += octets;
  }
  pieces.push(current);
  return pieces.join("\r\n ");
}

function property(name: string, value: string): string {
  return foldLine(`${name}:${value}`);
}

/** The whole calendar as text with CRLF line ends (§3.1), ready for text/calendar. */
export function calendarText(events: readonly CalendarEvent[], options: CalendarOptions = {}): string {
  const stamp = utcDateTime(options.stamp ?? new Date());
  const lines: string[] = [
    "BEGIN:VCALENDAR",
    "VERSION:2.0",
    property("PRODID", options.productId ?? SIGHTWARD_PRODUCT_ID),
    "CALSCALE:GREGORIAN",
  ];
  if (options.method) lines.push(`METHOD:${options.method}`);
  if (options.name) lines.push(property("X-WR-CALNAME", escapeText(options.name)));
  if (options.timeZone) lines.push(property("X-WR-TIMEZONE", escapeText(options.timeZone)));
  for (const event of events) {
    if (!(event.end.getTime() > event.start.getTime())) {
      throw new Error(`event ${event.uid} ends (${event.end.toISOString()}) before it starts (${event.start.toISOString()})`);
    }
    lines.push(
      "BEGIN:VEVENT",
      property("UID", escapeText(event.uid)),
      `DTSTAMP:${stamp}`,
      `DTSTART:${utcDateTime(event.start)}`,
      `DTEND:${utcDateTime(event.end)}`,
      property("SUMMARY", escapeText(event.summary)),
    );
    if (event.description) lines.push(property("DESCRIPTION", escapeText(event.description)));
    if (event.location) lines.push(property("LOCATION", escapeText(event.location)));
    if (event.sequence !== undefined) lines.push(`SEQUENCE:${Math.max(0, Math.trunc(event.sequence))}`);
    lines.push("TRANSP:OPAQUE", "END:VEVENT");
  }
  lines.push("END:VCALENDAR");
  return lines.join("\r\n") + "\r\n";
}
