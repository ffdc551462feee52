"use client";
// A site's settings, edited by an admin: time zone, locale, currency, the hourly rate and the extra
// hours a week a guard accepts by default. Saved over the values shown; a conflict says so.
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { siteSettingsSchema, type SiteSettingsInput } from "@/lib/api/site-settings";

// The form holds text; the schema's numbers come from it.
interface FormValues {
  timeZone: string;
  locale: string;
  currency: string;
  hourlyRate: string;
  acceptedExtraHours: string;
}

function toForm(s: SiteSettingsInput): FormValues {
  return { ...s, hourlyRate: String(s.hourlyRate), acceptedExtraHours: s.acceptedExtraHours === null ? "" : String(s.acceptedExtraHours) };
}

function fromForm(v: FormValues): unknown {
  const number = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.replace(",", ".")));
  return { ...v, hourlyRate: number(v.hourlyRate), acceptedExtraHours: v.acceptedExtraHours.trim() === "" ? null : number(v.acceptedExtraHours) };
}

const FIELDS: { name: keyof FormValues; label: string; hint: string; inputMode?: "decimal" }[] = [
  { name: "timeZone", label: "Time zone", hint: "IANA name, e.g. Europe/Berlin" },
  { name: "locale", label: "Locale", hint: "how dates and numbers read, e.g. en-GB" },
  { name: "currency", label: "Currency", hint: "ISO 4217 code, e.g. EUR" },
  { name: "hourlyRate", label: "Hourly rate of a guard", hint: "in the site's currency", inputMode: "decimal" },
  { name: "acceptedExtraHours", label: "Extra hours a week a guard accepts", hint: "beyond contract, unless a guard says otherwise; empty = 8", inputMode: "decimal" },
];

export function SiteSettingsForm({ siteId, initial }: { siteId: number; initial: SiteSettingsInput }) {
  const [saved, setSaved] = useState<SiteSettingsInput>(initial);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const form = useForm<FormValues>({
    defaultValues: toForm(initial),
    // The shared zod schema judges the values (the form holds text; fromForm makes the numbers).
    resolver: async (values) => {
      const parsed = siteSettingsSchema.safeParse(fromForm(values));
      if (parsed.success) return { values, errors: {} };
      const errors: Record<string, { type: string; message: string }> = {};
      for (const issue of parsed.error.issues) errors[String(issue.path[0])] ??= { type: "invalid", message: issue.message };
      return { values: {}, errors };
    },
  });
  const errors = form.formState.errors;

  async function save(values: FormValues) {
    setMessage(null);
    try {
      const { settings } = await apiFetch<{ settings: SiteSettingsInput }>(`/api/sites/${siteId}/settings`, {
        method: "PUT",
        body: { previous: saved, settings: siteSettingsSchema.parse(fromForm(values)) },
      });
      setSaved(settings);
      form.reset(toForm(settings));
      setMessage({ kind: "ok", text: "Settings saved. New rosters use them; rosters already built keep theirs." });
    } catch (error) {
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The settings could not be saved; try again." });
    }
  }

  return (
    <form noValidate className="mt-4 space-y-3" onSubmit={form.handleSubmit(save)} aria-label={`Settings of site ${siteId}`}>
      <div className="grid gap-3 sm:grid-cols-2">
        {FIELDS.map((field) => {
          const id = `site-${siteId}-${field.name}`;
          const error = errors[field.name]?.message;
          return (
            <div key={field.name}>
              <label htmlFor={id} className="field-label">{field.label}</label>
              <input
                id={id}
                className="field-input"
                inputMode={field.inputMode}
                aria-invalid={error ? true : undefined}
                aria-describedby={`${id}-hint`}
                {...form.register(field.name)}
              />
              <p id={`${id}-hint`} className={error ? "text-sm text-alert-700" : "text-sm text-stone-700"} role={error ? "alert" : undefined}>
                {error ?? field.hint}
              </p>
            </div>
          );
        })}
      </div>
      <p className="text-sm text-stone-700">Labour-rule defaults are the product&apos;s starting point; contracts and local law govern.</p>
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="button" disabled={form.formState.isSubmitting || !form.formState.isDirty}>Save settings</button>
        {message && (
          <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "text-sm text-alert-700" : "text-sm text-ink-800"}>
            {message.text}
          </p>
        )}
      </div>
    </form>
  );
}
