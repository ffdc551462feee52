"use client";
// Adding and editing a guard: name, e-mail, contract and maximum hours, the extra hours they
// accept, skills; and taking them off the staff (kept for history, never rostered) or back on. A new
// guard gets an invitation mail to choose a password. The shared zod schema judges the form.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { guardUpdateSchema, skillsFromText } from "@/lib/api/guards";
import { schemaResolver } from "@/lib/forms/schema-resolver";
import type { PeopleGuard } from "./guards-table";

interface FormValues {
  name: string;
  email: string;
  contractHours: string;
  maxHours: string;
  acceptedExtraHours: string;
  skills: string;
  active: boolean;
}

const number = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.replace(",", ".")));

function fromForm(v: FormValues) {
  return {
    name: v.name,
    email: v.email,
    contractHours: number(v.contractHours),
    maxHours: number(v.maxHours),
    acceptedExtraHours: v.acceptedExtraHours.trim() === "" ? null : number(v.acceptedExtraHours),
    skills: skillsFromText(v.skills),
    active: v.active,
  };
}

function toForm(g: PeopleGuard | null): FormValues {
  return {
    name: g?.name ?? "",
    email: g?.email ?? "",
    contractHours: String(g?.contractHours ?? 40),
    maxHours: String(g?.maxHours ?? 48),
    acceptedExtraHours: g?.acceptedExtraHours == null ? "" : String(g.acceptedExtraHours),
    skills: (g?.skills ?? []).join(", "),
    active: g?.active ?? true,
  };
}

const FIELDS: { name: Exclude<keyof FormValues, "active">; label: string; hint?: string; inputMode?: "decimal" | "email" }[] = [
  { name: "name", label: "Name" },
  { name: "email", label: "E-mail", inputMode: "email" },
  { name: "contractHours", label: "Contract hours a week", inputMode: "decimal" },
  { name: "maxHours", label: "Maximum hours a week", hint: "the legal weekly limit, 48 h in the EU", inputMode: "decimal" },
  { name: "acceptedExtraHours", label: "Extra hours accepted", hint: "empty = the site's default", inputMode: "decimal" },
  { name: "skills", label: "Skills", hint: "comma-separated, e.g. high-value, first-aid" },
];

export function GuardForm({ siteId, guard, onDone }: { siteId: number; guard: PeopleGuard | null; onDone: () => void }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const form = useForm<FormValues>({
    defaultValues: toForm(guard),
    resolver: schemaResolver(guardUpdateSchema, fromForm),
  });
  const errors = form.formState.errors as Record<string, { message?: string } | undefined>;
  const prefix = guard ? `guard-${guard.id}` : "new-guard";

  async function save(values: FormValues) {
    setMessage(null);
    const body = fromForm(values);
    try {
      if (guard) await apiFetch(`/api/guards/${guard.id}`, { method: "PUT", body });
      else {
        const { active: _active, ...fields } = body;
        const answer = await apiFetch<{ warning?: string }>("/api/guards", { body: { siteId, ...fields } });
        if (answer.warning) {
          setMessage(answer.warning);
          router.refresh();
          return;
        }
      }
      router.refresh();
      onDone();
    } catch (error) {
      setMessage(error instanceof ApiRequestError ? error.message : "The guard could not be saved; try again.");
    }
  }

  return (
    <form noValidate aria-label={guard ? `Edit ${guard.name}` : "Add a guard"} className="space-y-3" onSubmit={form.handleSubmit(save)}>
      <div className="grid gap-3 sm:grid-cols-3">
        {FIELDS.map((field) => {
          const id = `${prefix}-${field.name}`;
          const error = errors[field.name]?.message;
          return (
            <div key={field.name}>
              <label htmlFor={id} className="field-label">{field.label}</label>
              <input id={id} className="field-input" inputMode={field.inputMode} aria-invalid={error ? true : undefined} {...form.register(field.name)} />
              {(error || field.hint) && <p className={error ? "text-sm text-alert-700" : "text-xs text-stone-700"} role={error ? "alert" : undefined}>{error ?? field.hint}</p>}
            </div>
          );
        })}
      </div>
      {guard && (
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...form.register("active")} /> On the staff (clear when the guard has left: kept for history, never rostered)
        </label>
      )}
      {!guard && <p className="text-sm text-stone-700">The guard gets an e-mail with a link to choose a password (it works once, for 7 days).</p>}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="button" disabled={form.formState.isSubmitting}>{guard ? "Save guard" : "Add guard"}</button>
        <button type="button" className="button-quiet" onClick={onDone}>Cancel</button>
      </div>
      {message && <p role="alert" className="text-sm text-alert-700">{message}</p>}
    </form>
  );
}

/** The button that opens the form in place: "Add a guard", or "Edit" in a guard's row. */
export function GuardEditor({ siteId, guard }: { siteId: number; guard: PeopleGuard | null }) {
  const [open, setOpen] = useState(false);
  if (open) return <GuardForm siteId={siteId} guard={guard} onDone={() => setOpen(false)} />;
  return (
    <button type="button" className={guard ? "button-quiet" : "button"} onClick={() => setOpen(true)} aria-label={guard ? `Edit ${guard.name}` : undefined}>
      {guard ? "Edit" : "Add a guard"}
    </button>
  );
}
