"use client";
// Creating or editing an exhibition: name, opening and closing dates, and which rooms are in it,
// each with its risk level, sight range and double cover. The shared zod schema judges the form;
// the server checks again and names the field of anything wrong.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import { DateField, dateFieldProblem } from "@/components/date-field";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { exhibitionUpdateSchema } from "@/lib/api/exhibitions";
import { schemaResolver } from "@/lib/forms/schema-resolver";

export interface SiteRoom {
  id: number;
  name: string;
  floor: string;
}

export interface ExhibitionValues {
  id?: number;
  name: string;
  startsOn: string;
  endsOn: string;
  rooms: { roomId: number; riskLevel: "standard" | "high"; sightRange: number | null; doubleCover: boolean }[];
}

interface FormValues {
  name: string;
  startsOn: string;
  endsOn: string;
  rooms: { included: boolean; riskLevel: "standard" | "high"; sightRange: string; doubleCover: boolean }[];
}

function toForm(values: ExhibitionValues, siteRooms: SiteRoom[]): FormValues {
  return {
    name: values.name,
    startsOn: values.startsOn,
    endsOn: values.endsOn,
    rooms: siteRooms.map((room) => {
      const setting = values.rooms.find((r) => r.roomId === room.id);
      return { included: Boolean(setting), riskLevel: setting?.riskLevel ?? "standard", sightRange: setting?.sightRange == null ? "" : String(setting.sightRange), doubleCover: setting?.doubleCover ?? false };
    }),
  };
}

function fromForm(values: FormValues, siteRooms: SiteRoom[]) {
  return {
    name: values.name,
    startsOn: values.startsOn,
    endsOn: values.endsOn,
    rooms: values.rooms.flatMap((r, i) =>
      r.included
        ? [{ roomId: siteRooms[i]!.id, riskLevel: r.riskLevel, sightRange: r.sightRange.trim() === "" ? null : Number(r.sightRange.replace(",", ".")), doubleCover: r.doubleCover }]
        : [],
    ),
  };
}

export function ExhibitionForm({ siteId, siteRooms, initial, onDone }: { siteId: number; siteRooms: SiteRoom[]; initial: ExhibitionValues; onDone: () => void }) {
  const router = useRouter();
  const { locale } = useSiteFormat();
  const [message, setMessage] = useState<string | null>(null);
  const form = useForm<FormValues>({
    defaultValues: toForm(initial, siteRooms),
    resolver: schemaResolver(
      exhibitionUpdateSchema,
      (values: FormValues) => fromForm(values, siteRooms),
      (issue, values) => {
        // A room's field error is shown under the rooms, naming the room.
        const index = issue.path[0] === "rooms" && typeof issue.path[1] === "number" ? issue.path[1] : null;
        if (index === null) return { field: String(issue.path[0]), message: issue.message };
        const roomId = fromForm(values, siteRooms).rooms[index]?.roomId;
        return { field: "rooms", message: `${siteRooms.find((r) => r.id === roomId)?.name ?? "A room"}: ${issue.message}` };
      },
    ),
  });
  const errors = form.formState.errors as Record<string, { message?: string } | undefined>;
  const prefix = initial.id ? `exhibition-${initial.id}` : "new-exhibition";
  const included = form.watch("rooms");
  const [startsOn, endsOn] = form.watch(["startsOn", "endsOn"]);
  const startsProblem = dateFieldProblem(locale, startsOn, errors.startsOn?.message);
  const endsProblem = dateFieldProblem(locale, endsOn, errors.endsOn?.message);

  async function save(values: FormValues) {
    setMessage(null);
    const body = fromForm(values, siteRooms);
    try {
      if (initial.id) await apiFetch(`/api/exhibitions/${initial.id}`, { method: "PUT", body });
      else await apiFetch("/api/exhibitions", { body: { siteId, ...body } });
      router.refresh();
      onDone();
    } catch (error) {
      setMessage(error instanceof ApiRequestError ? error.message : "The exhibition could not be saved; try again.");
    }
  }

  return (
    <form noValidate aria-label={initial.id ? `Edit ${initial.name}` : "New exhibition"} className="space-y-4" onSubmit={form.handleSubmit(save)}>
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor={`${prefix}-name`} className="field-label">Name</label>
          <input id={`${prefix}-name`} className="field-input" {...form.register("name")} aria-invalid={errors.name ? true : undefined} />
          {errors.name && <p role="alert" className="text-sm text-alert-700">{errors.name.message}</p>}
        </div>
        <div>
          <Controller
            control={form.control}
            name="startsOn"
            render={({ field }) => (
              <DateField id={`${prefix}-starts`} label="Opens" name={field.name} value={field.value} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} invalid={Boolean(errors.startsOn)} />
            )}
          />
          {startsProblem && <p role="alert" className="text-sm text-alert-700">{startsProblem}</p>}
        </div>
        <div>
          <Controller
            control={form.control}
            name="endsOn"
            render={({ field }) => (
              <DateField id={`${prefix}-ends`} label="Closes" name={field.name} value={field.value} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} invalid={Boolean(errors.endsOn)} />
            )}
          />
          {endsProblem && <p role="alert" className="text-sm text-alert-700">{endsProblem}</p>}
        </div>
      </div>
      <fieldset>
        <legend className="field-label">Rooms in the exhibition</legend>
        <div className="mt-1 overflow-x-auto">
          <table className="data-table">
            <thead>
              <tr>
                <th scope="col">Room</th>
                <th scope="col">Risk</th>
                <th scope="col">Sight range (m, empty = no limit)</th>
                <th scope="col">Double cover</th>
              </tr>
            </thead>
            <tbody>
              {siteRooms.map((room, i) => {
                const on = included[i]?.included ?? false;
                return (
                  <tr key={room.id}>
                    <td>
                      <label className="flex items-center gap-2">
                        <input type="checkbox" {...form.register(`rooms.${i}.included`)} />
                        <span>
                          {room.name} <span className="text-xs text-stone-600">({room.floor})</span>
                        </span>
                      </label>
                    </td>
                    <td>
                      <select aria-label={`Risk of ${room.name}`} className="field-input min-w-[8rem]" disabled={!on} {...form.register(`rooms.${i}.riskLevel`)}>
                        <option value="standard">standard</option>
                        <option value="high">high</option>
                      </select>
                    </td>
                    <td>
                      <input aria-label={`Sight range of ${room.name}`} className="field-input w-28" inputMode="decimal" disabled={!on} {...form.register(`rooms.${i}.sightRange`)} />
                    </td>
                    <td>
                      <input type="checkbox" aria-label={`Double cover in ${room.name}`} disabled={!on} {...form.register(`rooms.${i}.doubleCover`)} />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        {errors.rooms && <p role="alert" className="text-sm text-alert-700">{errors.rooms.message}</p>}
      </fieldset>
      <p className="text-sm text-stone-700">
        High-risk rooms need guards with the high-value skill and are kept guarded first. Posts never block exits; the plan is a sightline aid, local codes govern.
      </p>
      <div className="flex flex-wrap gap-3">
        <button type="submit" className="button" disabled={form.formState.isSubmitting}>{initial.id ? "Save exhibition" : "Create exhibition"}</button>
        <button type="button" className="button-quiet" onClick={onDone}>Cancel</button>
      </div>
      {message && <p role="alert" className="text-sm text-alert-700">{message}</p>}
    </form>
  );
}

/** The button that opens the form in place (new or edit), and "End today" for a running exhibition. */
export function ExhibitionEditor({ siteId, siteRooms, initial, today }: { siteId: number; siteRooms: SiteRoom[]; initial: ExhibitionValues | null; today: string }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const blank: ExhibitionValues = { name: "", startsOn: today, endsOn: today, rooms: [] };
  const running = initial !== null && initial.startsOn <= today && initial.endsOn > today;
  async function endToday() {
    if (!initial?.id) return;
    setMessage(null);
    try {
      await apiFetch(`/api/exhibitions/${initial.id}`, { method: "PUT", body: { name: initial.name, startsOn: initial.startsOn, endsOn: today, rooms: initial.rooms } });
      router.refresh();
    } catch (error) {
      setMessage(error instanceof ApiRequestError ? error.message : "The exhibition could not be ended; try again.");
    }
  }
  if (open) return <ExhibitionForm siteId={siteId} siteRooms={siteRooms} initial={initial ?? blank} onDone={() => setOpen(false)} />;
  return (
    <div className="flex flex-wrap gap-2">
      <button type="button" className={initial ? "button-quiet" : "button"} onClick={() => setOpen(true)}>
        {initial ? "Edit exhibition" : "New exhibition"}
      </button>
      {running && (
        <button type="button" className="button-quiet" onClick={() => void endToday()}>
          End today
        </button>
      )}
      {message && <p role="alert" className="text-sm text-alert-700">{message}</p>}
    </div>
  );
}
