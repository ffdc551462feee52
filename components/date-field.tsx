"use client";
// A date field in the site's own order (dd/mm/yyyy for en-GB), not the browser's month-first
// control. It shows and takes the locale's digits and hands "YYYY-MM-DD" to the form.
import { useEffect, useState } from "react";
import { dateInputShape, isCalendarDate, parseDateInput, toDateInput } from "@/lib/format";
import { useSiteFormat } from "./site-format";

/** The message under a date field: while it holds no date, what to type (the schemas speak of YYYY-MM-DD); else the form's own. */
export function dateFieldProblem(locale: string, value: string, message: string | undefined): string | undefined {
  if (!message || isCalendarDate(value)) return message;
  const placeholder = dateInputShape(locale).placeholder;
  return value ? `type a real date as ${placeholder}` : `give a date as ${placeholder}`;
}

export interface DateFieldProps {
  id: string;
  label: string;
  /** "YYYY-MM-DD" or "" */
  value: string;
  /** Called with "YYYY-MM-DD", or with what was typed when it is not a date yet (zod then names the problem). */
  onChange: (value: string) => void;
  onBlur?: () => void;
  name?: string;
  describedBy?: string;
  invalid?: boolean;
  required?: boolean;
  /** Keeps the label for screen readers only, where a row of fields shares one visible heading. */
  hideLabel?: boolean;
  /** Extra classes for the input (its width in a row of fields). */
  inputClassName?: string;
  /** react-hook-form's field ref, so a rejected form can focus the field. */
  inputRef?: React.Ref<HTMLInputElement>;
}

export function DateField({ id, label, value, onChange, onBlur, name, describedBy, invalid, required, hideLabel, inputClassName, inputRef }: DateFieldProps) {
  const { locale } = useSiteFormat();
  const shape = dateInputShape(locale);
  const [text, setText] = useState(() => (value ? toDateInput(locale, value) || value : ""));
  useEffect(() => {
    // Follow a value set from outside (a form reset), not our own typing.
    if (parseDateInput(locale, text) !== value && value !== text) setText(value ? toDateInput(locale, value) || value : "");
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value, locale]);
  return (
    <div>
      <label htmlFor={id} className={hideLabel ? "sr-only" : "field-label"}>
        {label} <span className="font-normal text-stone-700">({shape.placeholder})</span>
      </label>
      <input
        id={id}
        ref={inputRef}
        name={name}
        type="text"
        inputMode="numeric"
        autoComplete="off"
        placeholder={shape.placeholder}
        pattern={shape.pattern}
        title={`A date as ${shape.placeholder}`}
        required={required}
        value={text}
        aria-describedby={describedBy}
        aria-invalid={invalid || undefined}
        className={inputClassName ? `field-input ${inputClassName}` : "field-input"}
        onChange={(event) => {
          setText(event.target.value);
          onChange(parseDateInput(locale, event.target.value) ?? event.target.value);
        }}
        onBlur={onBlur}
      />
    </div>
  );
}
