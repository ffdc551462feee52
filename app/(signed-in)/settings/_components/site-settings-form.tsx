"use client";
// A site's settings, edited by an admin: its name and mail sender, time zone, locale, currency, the hourly rate, the extra
// hours a week a guard accepts by default, the opening hours per weekday and on special days, and the
// labour-rule defaults. Saved over the values shown; a conflict says so; a change that affects
// published rosters names the weeks to rebuild.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Controller, useFieldArray, useForm } from "react-hook-form";
import { DateField } from "@/components/date-field";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { siteSettingsSchema, type SiteSettingsInput } from "@/lib/api/site-settings";
import { dateInputShape, formatDate, isCalendarDate } from "@/lib/format";
import { schemaResolver } from "@/lib/forms/schema-resolver";
import { ENGINE_LABOUR_DEFAULTS, LABOUR_DEFAULT_KEYS } from "@/lib/scheduling/labour-defaults";

const WEEKDAYS = [
  ["mon", "Monday"],
  ["tue", "Tuesday"],
  ["wed", "Wednesday"],
  ["thu", "Thursday"],
  ["fri", "Friday"],
  ["sat", "Saturday"],
  ["sun", "Sunday"],
] as const;
type Weekday = (typeof WEEKDAYS)[number][0];

const RULE_LABELS: Record<(typeof LABOUR_DEFAULT_KEYS)[number], { label: string; hint: string }> = {
  minRestHours: { label: "Rest between shifts (h)", hint: "11 h in the EU (Directive 2003/88/EC, Art. 3)" },
  maxShiftHours: { label: "Longest shift (h)", hint: "" },
  minShiftHours: { label: "Shortest shift (h)", hint: "" },
  breakAfterHours: { label: "Break after (h of work)", hint: "a break past 6 h in the EU (Art. 4)" },
  breakMinutes: { label: "Break length (minutes)", hint: "national law sets it" },
};

// The form holds text; the schema's numbers come from it.
interface DayRow {
  closed: boolean;
  opens: string;
  closes: string;
}
interface FormValues {
  name: string;
  mailSender: string;
  timeZone: string;
  locale: string;
  currency: string;
  hourlyRate: string;
  acceptedExtraHours: string;
  weekly: Record<Weekday, DayRow>;
  dates: (DayRow & { date: string })[];
  rules: Record<(typeof LABOUR_DEFAULT_KEYS)[number], string>;
}

const row = (span: [string, string] | null | undefined): DayRow => (span ? { closed: false, opens: span[0], closes: span[1] } : { closed: true, opens: "10:00", closes: "18:00" });
const spanOf = (r: DayRow): [string, string] | null => (r.closed ? null : [r.opens, r.closes]);

function toForm(s: SiteSettingsInput): FormValues {
  const rules = { ...ENGINE_LABOUR_DEFAULTS, ...(s.rules ?? {}) };
  return {
    name: s.name ?? "",
    mailSender: s.mailSender ?? "",
    timeZone: s.timeZone,
    locale: s.locale,
    currency: s.currency,
    hourlyRate: String(s.hourlyRate),
    acceptedExtraHours: s.acceptedExtraHours === null ? "" : String(s.acceptedExtraHours),
    weekly: Object.fromEntries(WEEKDAYS.map(([d]) => [d, row(s.opening?.weekly[d])])) as Record<Weekday, DayRow>,
    dates: Object.entries(s.opening?.dates ?? {})
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([date, span]) => ({ date, ...row(span) })),
    rules: Object.fromEntries(LABOUR_DEFAULT_KEYS.map((k) => [k, String(rules[k])])) as FormValues["rules"],
  };
}

function fromForm(v: FormValues): unknown {
  const number = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.replace(",", ".")));
  return {
    name: v.name,
    mailSender: v.mailSender.trim() === "" ? null : v.mailSender,
    timeZone: v.timeZone,
    locale: v.locale,
    currency: v.currency,
    hourlyRate: number(v.hourlyRate),
    acceptedExtraHours: v.acceptedExtraHours.trim() === "" ? null : number(v.acceptedExtraHours),
    opening: {
      weekly: Object.fromEntries(WEEKDAYS.map(([d]) => [d, spanOf(v.weekly[d])])),
      dates: Object.fromEntries(v.dates.map((d) => [d.date, spanOf(d)])),
    },
    rules: Object.fromEntries(LABOUR_DEFAULT_KEYS.map((k) => [k, number(v.rules[k])])),
  };
}

const FIELDS: { name: "name" | "mailSender" | "timeZone" | "locale" | "currency" | "hourlyRate" | "acceptedExtraHours"; label: string; hint: string; inputMode?: "decimal" }[] = [
  { name: "name", label: "Name of the site", hint: "as pages and mails show it" },
  { name: "mailSender", label: "Mail sender", hint: "From address of the site's mail, e.g. Security <security@example.org>; empty = Sightward's own" },
  { name: "timeZone", label: "Time zone", hint: "IANA name, e.g. Europe/Berlin" },
  { name: "locale", label: "Locale", hint: "how dates and numbers read, e.g. en-GB" },
  { name: "currency", label: "Currency", hint: "ISO 4217 code, e.g. EUR" },
  { name: "hourlyRate", label: "Hourly rate of a guard", hint: "in the site's currency", inputMode: "decimal" },
  { name: "acceptedExtraHours", label: "Extra hours a week a guard accepts", hint: "beyond contract, unless a guard says otherwise; empty = 8", inputMode: "decimal" },
];

export function SiteSettingsForm({ siteId, initial }: { siteId: number; initial: SiteSettingsInput }) {
  const [saved, setSaved] = useState<SiteSettingsInput>(initial);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const format = useSiteFormat();
  const router = useRouter();
  const form = useForm<FormValues>({
    defaultValues: toForm(initial),
    // The shared zod schema judges the values (the form holds text; fromForm makes the numbers).
    resolver: schemaResolver(siteSettingsSchema, fromForm, (issue) => {
      // Opening and rules errors are shown beside their section, named by day or rule.
      const [head, kind, key] = issue.path.map(String);
      // A special day that is no date yet: say how to type it, in the field's own order.
      if (head === "opening" && kind === "dates" && key !== undefined && !isCalendarDate(key)) {
        const placeholder = dateInputShape(format.locale).placeholder;
        return { field: head, message: key ? `the special day “${key}”: type a real date as ${placeholder}` : `a special day has no date yet: give it as ${placeholder}` };
      }
      const day = key !== undefined && isCalendarDate(key) ? formatDate(format, key) : key ?? "";
      const where = head === "opening" ? (kind === "weekly" ? WEEKDAYS.find(([d]) => d === key)?.[1] ?? key : `the special day ${day}`) : head === "rules" ? RULE_LABELS[kind as keyof typeof RULE_LABELS]?.label ?? kind : null;
      return { field: head!, message: where ? `${where}: ${issue.message}` : issue.message };
    }),
  });
  const dates = useFieldArray({ control: form.control, name: "dates" });
  const errors = form.formState.errors as Record<string, { message?: string } | undefined>;
  const weekly = form.watch("weekly");
  const special = form.watch("dates");

  async function save(values: FormValues) {
    setMessage(null);
    try {
      const { settings, rebuild } = await apiFetch<{ settings: SiteSettingsInput; rebuild: string[] }>(`/api/sites/${siteId}/settings`, {
        method: "PUT",
        body: { previous: saved, settings: siteSettingsSchema.parse(fromForm(values)) },
      });
      setSaved(settings);
      form.reset(toForm(settings));
      // The site's name shows in headings and the shell: let the server parts show the new one.
      router.refresh();
      const weeks = rebuild.length ? ` Published weeks that started before this change: ${rebuild.map((week) => formatDate(format, week)).join(", ")}; rebuild them on Staffing to use it.` : "";
      setMessage({ kind: "ok", text: `Settings saved. New rosters use them; rosters already built keep theirs.${weeks}` });
    } catch (error) {
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The settings could not be saved; try again." });
    }
  }

  const id = (name: string) => `site-${siteId}-${name}`;
  return (
    <form noValidate className="mt-4 space-y-5" onSubmit={form.handleSubmit(save)} aria-label={`Settings of site ${siteId}`}>
      <div className="grid gap-3 sm:grid-cols-2">
        {FIELDS.map((field) => {
          const error = errors[field.name]?.message;
          return (
            <div key={field.name}>
              <label htmlFor={id(field.name)} className="field-label">{field.label}</label>
              <input id={id(field.name)} className="field-input" inputMode={field.inputMode} aria-invalid={error ? true : undefined} aria-describedby={`${id(field.name)}-hint`} {...form.register(field.name)} />
              <p id={`${id(field.name)}-hint`} className={error ? "text-sm text-alert-700" : "text-sm text-stone-700"} role={error ? "alert" : undefined}>
                {error ?? field.hint}
              </p>
            </div>
          );
        })}
      </div>

      <fieldset className="space-y-2">
        <legend className="font-semibold">Weekly opening</legend>
        {WEEKDAYS.map(([day, label]) => (
          <div key={day} className="flex flex-wrap items-center gap-3 text-sm">
            <span className="w-24 font-semibold">{label}</span>
            <label className="flex items-center gap-1">
              <input type="checkbox" aria-label={`${label} closed`} {...form.register(`weekly.${day}.closed`)} /> closed
            </label>
            <label className="flex items-center gap-1">
              opens <input type="text" inputMode="numeric" placeholder="hh:mm" pattern="([01][0-9]|2[0-3]):[0-5][0-9]|24:00" title="A 24-hour time such as 09:30" className="field-input mt-0 w-24" aria-label={`${label} opens`} disabled={weekly[day]?.closed} {...form.register(`weekly.${day}.opens`)} />
            </label>
            <label className="flex items-center gap-1">
              closes <input type="text" inputMode="numeric" placeholder="hh:mm" pattern="([01][0-9]|2[0-3]):[0-5][0-9]|24:00" title="A 24-hour time such as 09:30" className="field-input mt-0 w-24" aria-label={`${label} closes`} disabled={weekly[day]?.closed} {...form.register(`weekly.${day}.closes`)} />
            </label>
          </div>
        ))}
      </fieldset>

      <fieldset className="space-y-2">
        <legend className="font-semibold">Special days (closures, late openings)</legend>
        {dates.fields.length === 0 && <p className="text-sm text-stone-700">None.</p>}
        {dates.fields.map((field, i) => (
          <div key={field.id} className="flex flex-wrap items-center gap-3 text-sm">
            <Controller
              control={form.control}
              name={`dates.${i}.date`}
              render={({ field: date }) => (
                <DateField id={id(`special-${field.id}`)} label={`Special day ${i + 1}`} hideLabel name={date.name} value={date.value} onChange={date.onChange} onBlur={date.onBlur} inputRef={date.ref} inputClassName="mt-0 w-44" />
              )}
            />
            <label className="flex items-center gap-1">
              <input type="checkbox" aria-label={`Special day ${i + 1} closed`} {...form.register(`dates.${i}.closed`)} /> closed
            </label>
            <input type="text" inputMode="numeric" placeholder="hh:mm" pattern="([01][0-9]|2[0-3]):[0-5][0-9]|24:00" title="A 24-hour time such as 09:30" className="field-input mt-0 w-24" aria-label={`Special day ${i + 1} opens`} disabled={special[i]?.closed} {...form.register(`dates.${i}.opens`)} />
            <input type="text" inputMode="numeric" placeholder="hh:mm" pattern="([01][0-9]|2[0-3]):[0-5][0-9]|24:00" title="A 24-hour time such as 09:30" className="field-input mt-0 w-24" aria-label={`Special day ${i + 1} closes`} disabled={special[i]?.closed} {...form.register(`dates.${i}.closes`)} />
            <button type="button" className="button-quiet" onClick={() => dates.remove(i)}>Remove</button>
          </div>
        ))}
        <button type="button" className="button-quiet" onClick={() => dates.append({ date: "", closed: true, opens: "10:00", closes: "18:00" })}>Add a special day</button>
        {errors.opening && <p role="alert" className="text-sm text-alert-700">{errors.opening.message}</p>}
      </fieldset>

      <fieldset className="space-y-2">
        <legend className="font-semibold">Labour-rule defaults</legend>
        <div className="grid gap-3 sm:grid-cols-3">
          {LABOUR_DEFAULT_KEYS.map((key) => (
            <div key={key}>
              <label htmlFor={id(`rule-${key}`)} className="field-label">{RULE_LABELS[key].label}</label>
              <input id={id(`rule-${key}`)} className="field-input" inputMode="decimal" {...form.register(`rules.${key}`)} />
              {RULE_LABELS[key].hint && <p className="text-xs text-stone-700">{RULE_LABELS[key].hint}</p>}
            </div>
          ))}
        </div>
        {errors.rules && <p role="alert" className="text-sm text-alert-700">{errors.rules.message}</p>}
        <p className="text-sm text-stone-700">These are the product&apos;s starting point; contracts and local law govern.</p>
      </fieldset>

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
