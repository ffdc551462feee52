// lib/format against references outside the project: date-fns (with @date-fns/tz and its en-GB and
// en-US locales) for the same dates, ISO 4217's minor units (JPY has none, EUR two), and the IANA
// time-zone data's Europe/Berlin clock change on 2027-03-28 (01:00 UTC, from +01:00 to +02:00).
import { describe, expect, it } from "vitest";
import { format } from "date-fns";
import { enGB, enUS } from "date-fns/locale";
import { TZDate } from "@date-fns/tz";
import {
  dateInputShape,
  formatClock,
  formatDate,
  formatDateTime,
  formatDay,
  formatDuration,
  formatMoney,
  formatSpan,
  formatTime,
  isCalendarDate,
  isCurrency,
  isLocale,
  isTimeZone,
  parseDateInput,
  siteClock,
  siteDate,
  siteFormat,
  toDateInput,
} from "@/lib/format";

const gb = siteFormat({ locale: "en-GB", time_zone: "Europe/Berlin", currency: "EUR" });
const us = siteFormat({ locale: "en-US", time_zone: "America/New_York", currency: "USD" });

describe("dates and times through the site's locale and zone", () => {
  it("writes a calendar date as date-fns does for the same locale, without moving the day", () => {
    for (const date of ["2026-12-02", "2027-01-11", "2027-03-28", "2026-01-01", "2026-12-31"]) {
      const [y, m, d] = date.split("-").map(Number);
      const local = new Date(y!, m! - 1, d!);
      expect(formatDate(gb, date)).toBe(format(local, "d MMM yyyy", { locale: enGB }));
      expect(formatDate(us, date)).toBe(format(local, "MMM d, yyyy", { locale: enUS }));
      expect(formatDay(gb, date)).toBe(format(local, "EEE, d MMM yyyy", { locale: enGB }));
    }
  });

  it("writes an instant in the site's time zone, as @date-fns/tz does", () => {
    const instant = new Date("2026-12-02T23:30:00Z"); // already 3 December in Berlin
    expect(formatDate(gb, instant)).toBe(format(new TZDate(instant, "Europe/Berlin"), "d MMM yyyy", { locale: enGB }));
    expect(formatDate(gb, instant)).toBe("3 Dec 2026");
    expect(siteDate(gb, instant)).toBe("2026-12-03");
    expect(formatTime(gb, instant)).toBe("00:30");
    expect(formatDateTime(gb, instant)).toBe("Thu, 3 Dec 2026, 00:30");
    expect(formatTime(us, instant)).toBe("06:30 PM"); // New York is UTC-5 in December (IANA)
  });

  it("follows the Europe/Berlin clock change of 2027-03-28 (IANA time-zone data)", () => {
    expect(siteClock(gb, "2027-03-28T00:59:00Z")).toBe("01:59");
    expect(siteClock(gb, "2027-03-28T01:00:00Z")).toBe("03:00");
    expect(formatSpan(gb, "2027-03-28T00:30:00Z", "2027-03-28T01:30:00Z")).toBe("Sun, 28 Mar 2027, 01:30–03:30");
  });

  it("shows stored wall-clock times the locale's way", () => {
    expect(formatClock(gb, "09:00")).toBe("09:00");
    expect(formatClock(gb, "17:30")).toBe("17:30");
    expect(formatClock(us, "17:30")).toBe("05:30 PM");
  });
});

describe("money and durations", () => {
  it("uses the currency's minor units from ISO 4217 (EUR 2, JPY 0)", () => {
    expect(formatMoney(gb, 1234.5)).toBe("€1,234.50");
    expect(formatMoney({ ...gb, currency: "JPY" }, 1234.5)).toBe("JP¥1,235");
    expect(formatMoney({ ...gb, locale: "de-DE" }, 1234.5)).toBe("1.234,50\u00a0€");
    expect(formatMoney(us, 99.999, { whole: true })).toBe("$100");
  });

  it("writes durations in hours and minutes", () => {
    expect(formatDuration(gb, 45)).toBe("45 min");
    expect(formatDuration(gb, 420)).toBe("7 h");
    expect(formatDuration(gb, 450)).toBe("7 h 30 min");
  });
});

describe("date inputs in the locale's order", () => {
  it("is day-first for en-GB and de-DE, month-first for en-US", () => {
    expect(dateInputShape("en-GB").placeholder).toBe("dd/mm/yyyy");
    expect(dateInputShape("de-DE").placeholder).toBe("dd.mm.yyyy");
    expect(dateInputShape("en-US").placeholder).toBe("mm/dd/yyyy");
    expect(toDateInput("en-GB", "2027-01-18")).toBe("18/01/2027");
    expect(toDateInput("en-US", "2027-01-18")).toBe("01/18/2027");
  });

  it("reads what was typed in that order and refuses dates that do not exist", () => {
    expect(parseDateInput("en-GB", "18/01/2027")).toBe("2027-01-18");
    expect(parseDateInput("en-GB", "2/12/2026")).toBe("2026-12-02");
    expect(parseDateInput("en-US", "01/18/2027")).toBe("2027-01-18");
    expect(parseDateInput("en-GB", "01/18/2027")).toBeNull(); // month 18
    expect(parseDateInput("de-DE", "18.01.2027")).toBe("2027-01-18");
    expect(parseDateInput("en-GB", "29/02/2027")).toBeNull(); // 2027 is no leap year
    expect(parseDateInput("en-GB", "29/02/2028")).toBe("2028-02-29");
    expect(parseDateInput("en-GB", "tomorrow")).toBeNull();
    expect(new RegExp(`^${dateInputShape("en-GB").pattern}$`).test("18/01/2027")).toBe(true);
    expect(isCalendarDate("2026-02-30")).toBe(false);
  });
});

describe("settings values", () => {
  it("knows real zones, locales and ISO 4217 codes from the ones that are not", () => {
    expect(isTimeZone("Europe/Berlin")).toBe(true);
    expect(isTimeZone("Mars/Olympus")).toBe(false);
    expect(isLocale("en-GB")).toBe(true);
    expect(isLocale("not a locale")).toBe(false);
    expect(isCurrency("EUR")).toBe(true);
    expect(isCurrency("GBP")).toBe(true);
    expect(isCurrency("EURO")).toBe(false);
    expect(isCurrency("XYZ")).toBe(false);
  });
});
