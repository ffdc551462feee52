// The roster CSV writer: cells follow RFC 4180 quoting and OWASP's CSV injection guidance, read
// back by papaparse (an independent CSV parser from npm).
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvCell, rosterCsv, rosterCsvRows, ROSTER_CSV_COLUMNS, signInLines, toCsv } from "@/lib/rosters/export";

describe("csvCell", () => {
  // OWASP, "CSV Injection": prefix cells beginning with =, +, -, @, tab (0x09) or carriage return (0x0D) with a single quote.
  it.each(["=1+2", "+1", "-3", "@SUM(A1:A2)", "\tx", "\rx"])("makes %j text with a leading apostrophe", (value) => {
    const cell = csvCell(value);
    const [[read]] = Papa.parse<string[]>(`${cell}\r\n`, { delimiter: ",", newline: "\r\n", skipEmptyLines: true }).data;
    expect(read).toBe(`'${value}`);
  });

  it("leaves ordinary text alone and quotes commas, quotes and line breaks (RFC 4180 section 2)", () => {
    expect(csvCell("Textile Gallery")).toBe("Textile Gallery");
    expect(csvCell('Hall "A", east')).toBe('"Hall ""A"", east"');
    expect(csvCell("two\nlines")).toBe('"two\nlines"');
    const text = toCsv(["a", "b"], [{ a: 'Hall "A", east', b: "two\nlines" }]);
    expect(Papa.parse(text, { header: true, skipEmptyLines: true }).data).toEqual([{ a: 'Hall "A", east', b: "two\nlines" }]);
  });

  it("does not prefix a formula character inside the text", () => {
    expect(csvCell("a=b")).toBe("a=b");
    expect(csvCell("Room 1-2")).toBe("Room 1-2");
  });
});

const zone = "Europe/Berlin";
// 2027-03-23 is CET (UTC+1): 09:00 local is 08:00Z.
const roster = {
  timeZone: zone,
  posts: [
    { id: "R1-P1", label: "Textile Gallery · post 1", room: "Textile Gallery" },
    { id: "R2-P1", label: "=HYPERLINK(\"x\") · post 1", room: "=HYPERLINK(\"x\")" },
  ],
  shifts: [
    {
      guardId: 2,
      guardName: "Ada Okafor",
      start: "2027-03-23T09:00:00.000Z",
      end: "2027-03-23T14:00:00.000Z",
      segments: [{ post: "R2-P1", start: "2027-03-23T09:00:00.000Z", end: "2027-03-23T14:00:00.000Z" }],
      breaks: [],
    },
    {
      guardId: 1,
      guardName: "Mara Lindqvist",
      start: "2027-03-23T08:00:00.000Z",
      end: "2027-03-23T15:00:00.000Z",
      segments: [
        { post: "R1-P1", start: "2027-03-23T08:00:00.000Z", end: "2027-03-23T10:00:00.000Z" },
        { post: "R2-P1", start: "2027-03-23T10:00:00.000Z", end: "2027-03-23T12:00:00.000Z" },
        { post: "R1-P1", start: "2027-03-23T13:00:00.000Z", end: "2027-03-23T15:00:00.000Z" },
      ],
      breaks: [{ start: "2027-03-23T12:00:00.000Z", end: "2027-03-23T13:00:00.000Z" }],
    },
  ],
};

describe("rosterCsv", () => {
  it("writes one row per assignment in local time, in time order, that papaparse reads back", () => {
    const parsed = Papa.parse<Record<string, string>>(rosterCsv(roster), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...ROSTER_CSV_COLUMNS]);
    expect(parsed.data.map((r) => [r.start, r.end, r.guard, r.break])).toEqual([
      ["09:00", "11:00", "Mara Lindqvist", "no"],
      ["10:00", "15:00", "Ada Okafor", "no"],
      ["11:00", "13:00", "Mara Lindqvist", "no"],
      ["13:00", "14:00", "Mara Lindqvist", "yes"],
      ["14:00", "16:00", "Mara Lindqvist", "no"],
    ]);
    expect(parsed.data.every((r) => r.date === "2027-03-23")).toBe(true);
    // The room named like a formula comes back as text.
    expect(parsed.data[1]!.room).toBe("'=HYPERLINK(\"x\")");
    expect(parsed.data[1]!.post).toBe("'=HYPERLINK(\"x\") · post 1");
    expect(parsed.data[3]!.post).toBe("");
    expect(rosterCsvRows(roster)).toHaveLength(5);
  });

  it("lists the day's guards for the sign-in sheet by start, with first post and breaks", () => {
    expect(signInLines(roster, "2027-03-23")).toEqual([
      { guardName: "Mara Lindqvist", start: "09:00", end: "16:00", firstPost: "Textile Gallery · post 1", breaks: "13:00–14:00" },
      { guardName: "Ada Okafor", start: "10:00", end: "15:00", firstPost: "=HYPERLINK(\"x\") · post 1", breaks: "" },
    ]);
    expect(signInLines(roster, "2027-03-24")).toEqual([]);
  });
});
