"use client";
// Staff from a CSV file: the preview first (the guards it would add, or every problem by line and
// column), then the import; a file with any bad row saves nothing.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import type { StaffProblem, StaffRow } from "@/lib/people/staff-csv";

export function StaffImport({ siteId }: { siteId: number }) {
  const router = useRouter();
  const [csv, setCsv] = useState<string | null>(null);
  const [file, setFile] = useState<string>("");
  const [preview, setPreview] = useState<StaffRow[] | null>(null);
  const [problems, setProblems] = useState<StaffProblem[]>([]);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function check(text: string) {
    setBusy(true);
    setPreview(null);
    setProblems([]);
    setMessage(null);
    try {
      const answer = await apiFetch<{ preview: StaffRow[] }>("/api/guards/import", { body: { siteId, csv: text, dryRun: true } });
      setPreview(answer.preview);
    } catch (error) {
      if (error instanceof ApiRequestError && Array.isArray(error.details.problems)) setProblems(error.details.problems as StaffProblem[]);
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The file could not be checked; try again." });
    } finally {
      setBusy(false);
    }
  }

  async function commit() {
    if (!csv) return;
    setBusy(true);
    try {
      const answer = await apiFetch<{ imported: unknown[]; warning?: string }>("/api/guards/import", { body: { siteId, csv, dryRun: false } });
      setMessage({ kind: answer.warning ? "error" : "ok", text: `Imported ${answer.imported.length} guards; each got an invitation to choose a password.${answer.warning ? ` ${answer.warning}` : ""}` });
      setPreview(null);
      setCsv(null);
      router.refresh();
    } catch (error) {
      if (error instanceof ApiRequestError && Array.isArray(error.details.problems)) setProblems(error.details.problems as StaffProblem[]);
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The import failed; nothing was saved." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-3" data-testid="staff-import">
      <label className="block">
        <span className="field-label">Import guards from a CSV file</span>
        <input
          type="file"
          accept=".csv,text/csv"
          className="mt-1 block text-sm"
          onChange={async (event) => {
            const chosen = event.target.files?.[0];
            event.target.value = "";
            if (!chosen) return;
            const text = await chosen.text();
            setFile(chosen.name);
            setCsv(text);
            await check(text);
          }}
        />
        <span className="mt-1 block text-xs text-stone-700">
          Columns: name, email, contract_hours, max_hours (default 48), accepted_extra_hours (empty = the site&apos;s default), skills (separated by ;).
        </span>
      </label>
      {busy && <p role="status" className="text-sm">Checking {file}…</p>}
      {problems.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-alert-700" aria-label="Problems in the file">
          {problems.slice(0, 50).map((p, i) => (
            <li key={i}>
              line {p.line}, {p.column}: {p.message}
            </li>
          ))}
          {problems.length > 50 && <li>and {problems.length - 50} more</li>}
        </ul>
      )}
      {preview && (
        <div className="space-y-2">
          <div className="overflow-x-auto">
            <table className="data-table">
              <caption className="text-left font-semibold">{file}: {preview.length} guards to add</caption>
              <thead>
                <tr>
                  <th scope="col">Line</th>
                  <th scope="col">Name</th>
                  <th scope="col">E-mail</th>
                  <th scope="col">Contract h</th>
                  <th scope="col">Max h</th>
                  <th scope="col">Skills</th>
                </tr>
              </thead>
              <tbody>
                {preview.map((row) => (
                  <tr key={row.line}>
                    <td>{row.line}</td>
                    <td>{row.name}</td>
                    <td>{row.email}</td>
                    <td>{row.contractHours}</td>
                    <td>{row.maxHours}</td>
                    <td>{row.skills.join(", ") || "none"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="flex gap-2">
            <button type="button" className="button" disabled={busy} onClick={() => void commit()}>Import {preview.length} guards</button>
            <button type="button" className="button-quiet" onClick={() => { setPreview(null); setCsv(null); }}>Cancel</button>
          </div>
        </div>
      )}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "text-sm text-alert-700" : "text-sm text-ok-700"}>
          {message.text}
        </p>
      )}
    </div>
  );
}
