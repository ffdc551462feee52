// Staff from a CSV file (papaparse): one guard per row under a header of name, email,
// contract_hours, max_hours (default 48), accepted_extra_hours (empty = the site's default) and
// skills (separated by ";" or "|"). Every row is checked with the People form's own schema; a file
// with any bad row is refused whole, each problem named by its line and column.
import Papa from "papaparse";
import { guardCreateSchema } from "@/lib/api/guards";

export interface StaffRow {
  line: number;
  name: string;
  email: string;
  contractHours: number;
  maxHours: number;
  acceptedExtraHours: number | null;
  skills: string[];
}

export interface StaffProblem {
  line: number;
  column: string;
  message: string;
}

export const STAFF_COLUMNS = ["name", "email", "contract_hours", "max_hours", "accepted_extra_hours", "skills"] as const;
const REQUIRED = ["name", "email", "contract_hours"] as const;
/** Cells a spreadsheet would run as a formula (OWASP, "CSV Injection"). */
const FORMULA = /^[=+\-@\t\r]/;

const COLUMN_OF: Record<string, string> = { name: "name", email: "email", contractHours: "contract_hours", maxHours: "max_hours", acceptedExtraHours: "accepted_extra_hours", skills: "skills" };

export function readStaffCsv(text: string, maxRows = 2000): { rows: StaffRow[]; problems: StaffProblem[] } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: "greedy", transformHeader: (h) => h.trim().toLowerCase() });
  const problems: StaffProblem[] = [];
  const header = parsed.meta.fields ?? [];
  for (const column of REQUIRED) if (!header.includes(column)) problems.push({ line: 1, column, message: `the header has no ${column} column; the columns are ${STAFF_COLUMNS.join(", ")}` });
  for (const column of header) if (!(STAFF_COLUMNS as readonly string[]).includes(column)) problems.push({ line: 1, column, message: `unknown column ${column}; the columns are ${STAFF_COLUMNS.join(", ")}` });
  for (const error of parsed.errors) problems.push({ line: (error.row ?? 0) + 2, column: "(row)", message: error.message });
  if (problems.length > 0) return { rows: [], problems };
  if (parsed.data.length === 0) return { rows: [], problems: [{ line: 2, column: "(file)", message: "the file has a header but no guards" }] };
  if (parsed.data.length > maxRows) return { rows: [], problems: [{ line: maxRows + 2, column: "(file)", message: `at most ${maxRows} guards per file` }] };

  const rows: StaffRow[] = [];
  const seen = new Map<string, number>();
  parsed.data.forEach((record, i) => {
    const line = i + 2;
    const cell = (column: string) => (record[column] ?? "").trim();
    for (const column of STAFF_COLUMNS) {
      // The cell as written counts too: a leading tab or carriage return is itself a formula lead.
      const raw = record[column] ?? "";
      if ((FORMULA.test(cell(column)) && !(column.endsWith("hours") && /^-?\d/.test(cell(column)))) || /^[\t\r]/.test(raw)) {
        const lead = /^[\t\r]/.test(raw) ? (raw[0] === "\t" ? "a tab" : "a carriage return") : cell(column).slice(0, 1);
        problems.push({ line, column, message: `starts like a spreadsheet formula (${lead}); remove it` });
      }
    }
    const number = (text: string) => (text === "" ? Number.NaN : Number(text.replace(",", ".")));
    const candidate = {
      siteId: 1,
      name: cell("name"),
      email: cell("email"),
      contractHours: number(cell("contract_hours")),
      maxHours: cell("max_hours") === "" ? 48 : number(cell("max_hours")),
      acceptedExtraHours: cell("accepted_extra_hours") === "" ? null : number(cell("accepted_extra_hours")),
      skills: cell("skills") === "" ? [] : cell("skills").split(/[;|]/).map((s) => s.trim()).filter(Boolean),
    };
    const result = guardCreateSchema.safeParse(candidate);
    if (!result.success) {
      for (const issue of result.error.issues) problems.push({ line, column: COLUMN_OF[String(issue.path[0])] ?? String(issue.path[0]), message: issue.message });
      return;
    }
    const earlier = seen.get(result.data.email);
    if (earlier !== undefined) {
      problems.push({ line, column: "email", message: `${result.data.email} is already on line ${earlier}` });
      return;
    }
    seen.set(result.data.email, line);
    const { siteId: _site, ...fields } = result.data;
    rows.push({ line, ...fields });
  });
  return problems.length > 0 ? { rows: [], problems } : { rows, problems };
}
