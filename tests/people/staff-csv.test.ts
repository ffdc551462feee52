// Staff CSV files (RFC 4180 quoting, read by papaparse): good rows become guards with the People
// form's own rules; each problem is named by its line and column, and a file with one bad row
// gives no rows at all; cells that a spreadsheet would run as formulas are refused (OWASP, "CSV
// Injection").
import { describe, expect, it } from "vitest";
import { readStaffCsv } from "@/lib/people/staff-csv";

describe("reading a staff file", () => {
  it("reads rows, quoted cells, defaults and skills", () => {
    const { rows, problems } = readStaffCsv(
      'name,email,contract_hours,max_hours,accepted_extra_hours,skills\n"Ahmadi, Leyla",Leyla.Ahmadi@example.org,32,,4,first-aid;evening\nTom Berg,tom.berg@example.org,20,40,,\n',
    );
    expect(problems).toEqual([]);
    expect(rows).toEqual([
      { line: 2, name: "Ahmadi, Leyla", email: "leyla.ahmadi@example.org", contractHours: 32, maxHours: 48, acceptedExtraHours: 4, skills: ["first-aid", "evening"] },
      { line: 3, name: "Tom Berg", email: "tom.berg@example.org", contractHours: 20, maxHours: 40, acceptedExtraHours: null, skills: [] },
    ]);
  });

  it("names every problem by line and column and gives no rows", () => {
    const { rows, problems } = readStaffCsv(
      "name,email,contract_hours,skills\nAda,ada@example.org,30,\nBo,not-an-address,30,\n=HYPERLINK(\"x\"),c@example.org,30,\nDi,ada@example.org,70,\n",
    );
    expect(rows).toEqual([]);
    expect(problems).toEqual(
      expect.arrayContaining([
        { line: 3, column: "email", message: expect.stringMatching(/e-mail address/) },
        { line: 4, column: "name", message: expect.stringMatching(/spreadsheet formula/) },
        { line: 5, column: "contract_hours", message: expect.stringMatching(/at most 60/) },
      ]),
    );
  });

  it("refuses a file without the needed columns, or an unknown one", () => {
    expect(readStaffCsv("name,mail\nA,a@example.org\n").problems.map((p) => p.column).sort()).toEqual(["contract_hours", "email", "mail"]);
    expect(readStaffCsv("name,email,contract_hours\n").problems[0]!.message).toMatch(/no guards/);
  });
});
