// POST /api/guards/import { siteId, csv, dryRun }: staff from a CSV file (lib/people/staff-csv.ts).
// With dryRun, the preview: the guards it would add. Without, all of them in one transaction, each
// with an account and an invitation mail. A file with any bad row, or an address already on the
// staff, saves nothing and answers 422 with every problem by line and column.
import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { db } from "@/db";
import { siteExists } from "@/db/queries/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { addGuardWithAccount, guardAddressProblem, inviteNewGuard } from "@/lib/people/add-guard";
import { readStaffCsv, type StaffProblem } from "@/lib/people/staff-csv";
import { recordAudit } from "@/lib/audit/record";

const importSchema = z.object({
  siteId: z.number().int().positive().max(2_147_483_647),
  csv: z.string().min(1, "the file is empty").max(1_000_000, "the file is larger than 1 MB"),
  dryRun: z.boolean().default(false),
});

export const POST = route(async (request: NextRequest) => {
  const manager = await requireRole(request, "people:edit");
  const body = await parseBody(request, importSchema);
  if (!(await siteExists(db, body.siteId))) throw new ApiProblem(422, "invalid-input", `There is no site ${body.siteId}; reload the page.`, { field: "siteId" });
  const { rows, problems } = readStaffCsv(body.csv);
  const refuse = (list: StaffProblem[]) => {
    throw new ApiProblem(422, "bad-staff-file", `Nothing was imported: ${list.length} problem${list.length === 1 ? "" : "s"}, first on line ${list[0]!.line} (${list[0]!.column}): ${list[0]!.message}.`, { problems: list });
  };
  if (problems.length > 0) refuse(problems);
  const taken: StaffProblem[] = [];
  for (const row of rows) {
    const problem = await guardAddressProblem(db, body.siteId, row.email);
    if (problem) taken.push({ line: row.line, column: "email", message: problem });
  }
  if (taken.length > 0) refuse(taken);
  if (body.dryRun) return NextResponse.json({ preview: rows });

  const created = await db.transaction().execute(async (trx) => {
    const out = [];
    for (const { line, ...fields } of rows) {
      // Checked again inside the transaction: someone may have added the same person meanwhile.
      const added = await addGuardWithAccount(trx, body.siteId, fields);
      if (!added.ok) refuse([{ line, column: "email", message: added.message }]);
      else out.push(added);
    }
    await recordAudit(trx, manager, { action: "guard.import", subject: { type: "site", id: body.siteId }, siteId: body.siteId, summary: `imported ${out.length} guard(s) from a staff file`, changes: { guards: out.map((c) => ({ id: c.guard.id, name: c.guard.name, email: c.guard.email })) } });
    return out;
  });
  let unmailed = 0;
  for (const added of created) if ((await inviteNewGuard(db, added, manager.id))?.mailed === false) unmailed++;
  return NextResponse.json(
    {
      imported: created.map((c) => c.guard),
      ...(unmailed ? { warning: `${unmailed} invitation${unmailed === 1 ? "" : "s"} did not go out; an administrator can send new links from Users.` } : {}),
    },
    { status: 201 },
  );
});
