"use client";
// The galleries as curators run them: every site with its floors and rooms, and (for those who edit
// rooms) the forms to add a site, a floor or a room, rename, reorder and delete them. A floor or
// room in an exhibition or with an approved plan is deleted only after the page has said so.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, type ReactNode } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { floorCreateSchema, renameSchema, roomCreateSchema, siteCreateSchema, type FloorCreateInput, type RoomCreateInput, type SiteCreateInput } from "@/lib/api/galleries";
import type { GalleryFloor, GalleryRoom, GallerySite } from "@/db/queries/galleries";
import { RoomOutline } from "@/components/room-outline";
import { RoomsUpload } from "./rooms-upload";

type Feedback = { kind: "ok" | "error"; text: string } | null;

function messageOf(error: unknown): string {
  return error instanceof ApiRequestError ? error.message : "That did not work; try again.";
}

function useRefresh() {
  const router = useRouter();
  return () => router.refresh();
}

export function GalleriesManager({ sites, editable }: { sites: GallerySite[]; editable: boolean }) {
  return (
    <div className="space-y-10">
      {sites.length === 0 && <p>No sites yet.{editable ? " Add the first one below." : ""}</p>}
      {sites.map((site) => (
        <SiteSection key={site.id} site={site} editable={editable} />
      ))}
      {editable && <NewSiteForm />}
    </div>
  );
}

function SiteSection({ site, editable }: { site: GallerySite; editable: boolean }) {
  return (
    <section aria-labelledby={`site-${site.id}`} className="space-y-6">
      <div className="flex flex-wrap items-baseline gap-3">
        <h2 id={`site-${site.id}`} className="text-xl">{site.name}</h2>
        {editable && <RenameControl what="site" name={site.name} url={`/api/sites/${site.id}`} />}
        {editable && <DeleteControl what="site" name={site.name} url={`/api/sites/${site.id}`} inUse={site.floors.some((f) => f.rooms.some(inUse))} />}
      </div>
      {site.floors.length === 0 && <p>No floors yet.</p>}
      {site.floors.map((floor, index) => (
        <FloorSection key={floor.id} floor={floor} editable={editable} siblings={site.floors} index={index} siteId={site.id} />
      ))}
      {editable && <NewFloorForm siteId={site.id} />}
    </section>
  );
}

const inUse = (room: GalleryRoom) => room.exhibitions.length > 0 || room.approvedPlans > 0;

function FloorSection({ floor, editable, siblings, index, siteId }: { floor: GalleryFloor; editable: boolean; siblings: GalleryFloor[]; index: number; siteId: number }) {
  const refresh = useRefresh();
  const [feedback, setFeedback] = useState<Feedback>(null);
  async function moveFloor(by: -1 | 1) {
    const ids = siblings.map((f) => f.id);
    [ids[index], ids[index + by]] = [ids[index + by]!, ids[index]!];
    try {
      await apiFetch(`/api/sites/${siteId}/floor-order`, { method: "PUT", body: { ids } });
      refresh();
    } catch (error) {
      setFeedback({ kind: "error", text: messageOf(error) });
    }
  }
  async function moveRoom(position: number, by: -1 | 1) {
    const ids = floor.rooms.map((r) => r.id);
    [ids[position], ids[position + by]] = [ids[position + by]!, ids[position]!];
    try {
      await apiFetch(`/api/floors/${floor.id}/room-order`, { method: "PUT", body: { ids } });
      refresh();
    } catch (error) {
      setFeedback({ kind: "error", text: messageOf(error) });
    }
  }
  return (
    <section aria-labelledby={`floor-${floor.id}`} className="space-y-3" data-testid={`floor-${floor.id}`}>
      <div className="flex flex-wrap items-baseline gap-3">
        <h3 id={`floor-${floor.id}`} className="text-lg">
          {floor.name} <span className="text-base font-normal text-stone-600">(level {floor.level})</span>
        </h3>
        <Link href={`/galleries/floors/${floor.id}/map`} className="text-sm" aria-label={`Floor map of ${floor.name}`}>Floor map</Link>
        {editable && (
          <>
            <RenameControl what="floor" name={floor.name} url={`/api/floors/${floor.id}`} method="PATCH" />
            <button type="button" className="button-quiet" disabled={index === 0} onClick={() => void moveFloor(-1)} aria-label={`Move ${floor.name} up`}>
              ↑
            </button>
            <button type="button" className="button-quiet" disabled={index === siblings.length - 1} onClick={() => void moveFloor(1)} aria-label={`Move ${floor.name} down`}>
              ↓
            </button>
            <DeleteControl what="floor" name={floor.name} url={`/api/floors/${floor.id}`} inUse={floor.rooms.some(inUse)} />
          </>
        )}
      </div>
      <FeedbackLine feedback={feedback} />
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {floor.rooms.map((room, position) => (
          <li key={room.id} className="card space-y-2" data-testid={`room-card-${room.id}`}>
            <div className="flex items-center gap-4">
              <RoomOutline outline={room.outline} obstacles={room.obstacles} label={`Outline of ${room.name}`} />
              <div>
                <h4 className="font-semibold">
                  <Link href={`/galleries/${room.id}`}>{room.name}</Link>
                </h4>
                <dl className="mt-1 grid grid-cols-[auto_auto] gap-x-3 text-sm">
                  <dt className="text-stone-700">Vertices</dt>
                  <dd className="font-semibold">{room.outline.length + room.obstacles.reduce((n, ring) => n + ring.length, 0)}</dd>
                  <dt className="text-stone-700">Obstacles</dt>
                  <dd className="font-semibold">{room.obstacles.length}</dd>
                  <dt className="text-stone-700">Version</dt>
                  <dd>{room.version}</dd>
                </dl>
                {room.exhibitions.length > 0 && <p className="text-xs text-stone-700">In {room.exhibitions.join(", ")}</p>}
                {room.staleApprovals > 0 && <p className="text-xs text-alert-700">Walls changed since the plan was approved: plan again.</p>}
              </div>
            </div>
            {editable && (
              <div className="flex flex-wrap gap-2">
                <RenameControl what="room" name={room.name} url={`/api/rooms/${room.id}`} method="PATCH" />
                <button type="button" className="button-quiet" disabled={position === 0} onClick={() => void moveRoom(position, -1)} aria-label={`Move ${room.name} earlier`}>
                  ←
                </button>
                <button type="button" className="button-quiet" disabled={position === floor.rooms.length - 1} onClick={() => void moveRoom(position, 1)} aria-label={`Move ${room.name} later`}>
                  →
                </button>
                <DeleteControl what="room" name={room.name} url={`/api/rooms/${room.id}`} inUse={inUse(room)} />
              </div>
            )}
          </li>
        ))}
        {floor.rooms.length === 0 && <li>No rooms on this floor.</li>}
      </ul>
      {editable && <NewRoomForm floorId={floor.id} floorName={floor.name} />}
      {editable && <RoomsUpload floorId={floor.id} floorName={floor.name} />}
    </section>
  );
}

function FeedbackLine({ feedback }: { feedback: Feedback }) {
  if (!feedback) return null;
  return (
    <p role={feedback.kind === "error" ? "alert" : "status"} className={feedback.kind === "error" ? "text-sm text-alert-700" : "text-sm text-ink-800"}>
      {feedback.text}
    </p>
  );
}

/** A small disclosure: the button opens the form in place. */
function Disclosure({ label, children }: { label: string; children: (close: () => void) => ReactNode }) {
  const [open, setOpen] = useState(false);
  return open ? (
    <div className="w-full">{children(() => setOpen(false))}</div>
  ) : (
    <button type="button" className="button-quiet" onClick={() => setOpen(true)} aria-expanded={false}>
      {label}
    </button>
  );
}

function RenameControl({ what, name, url, method = "PATCH" }: { what: string; name: string; url: string; method?: "PATCH" }) {
  const refresh = useRefresh();
  return (
    <Disclosure label={`Rename ${what}`}>
      {(close) => <RenameForm what={what} name={name} url={url} method={method} onDone={() => { close(); refresh(); }} onCancel={close} />}
    </Disclosure>
  );
}

function RenameForm({ what, name, url, method, onDone, onCancel }: { what: string; name: string; url: string; method: "PATCH"; onDone: () => void; onCancel: () => void }) {
  const form = useForm<{ name: string }>({ resolver: zodResolver(renameSchema), defaultValues: { name } });
  const [feedback, setFeedback] = useState<Feedback>(null);
  const id = `rename-${url.replace(/\W+/g, "-")}`;
  return (
    <form
      noValidate
      className="flex flex-wrap items-end gap-2"
      onSubmit={form.handleSubmit(async (values) => {
        try {
          await apiFetch(url, { method, body: values });
          onDone();
        } catch (error) {
          setFeedback({ kind: "error", text: messageOf(error) });
        }
      })}
    >
      <div>
        <label htmlFor={id} className="field-label">New name of the {what}</label>
        <input id={id} className="field-input" autoFocus {...form.register("name")} aria-invalid={form.formState.errors.name ? true : undefined} />
        {form.formState.errors.name && <p role="alert" className="text-sm text-alert-700">{form.formState.errors.name.message}</p>}
      </div>
      <button type="submit" className="button" disabled={form.formState.isSubmitting}>Rename</button>
      <button type="button" className="button-quiet" onClick={onCancel}>Cancel</button>
      <FeedbackLine feedback={feedback} />
    </form>
  );
}

function DeleteControl({ what, name, url, inUse: used }: { what: string; name: string; url: string; inUse: boolean }) {
  const refresh = useRefresh();
  const router = useRouter();
  const [asking, setAsking] = useState<string | null>(null);
  const [feedback, setFeedback] = useState<Feedback>(null);
  async function remove(confirm: boolean) {
    setFeedback(null);
    try {
      await apiFetch(`${url}${confirm ? "?confirm=yes" : ""}`, { method: "DELETE" });
      setAsking(null);
      refresh();
      router.refresh();
    } catch (error) {
      // In use: the server names what depends on it; ask once more before deleting.
      if (error instanceof ApiRequestError && error.status === 409) setAsking(error.message);
      else setFeedback({ kind: "error", text: messageOf(error) });
    }
  }
  if (asking) {
    return (
      <div role="alertdialog" aria-labelledby={`ask-${url}`} className="w-full rounded-md border border-alert-200 bg-alert-50 p-3 text-sm">
        <p id={`ask-${url}`} className="text-alert-700">{asking}</p>
        <div className="mt-2 flex flex-wrap gap-2">
          <button type="button" className="button-danger" onClick={() => void remove(true)} autoFocus>
            Delete {name} anyway
          </button>
          <button type="button" className="button-quiet" onClick={() => setAsking(null)}>Keep it</button>
        </div>
      </div>
    );
  }
  return (
    <>
      <button
        type="button"
        className="button-quiet"
        onClick={() => {
          if (used || window.confirm(`Delete the ${what} ${name}? Its drawings and history go with it.`)) void remove(false);
        }}
      >
        Delete {what}
      </button>
      <FeedbackLine feedback={feedback} />
    </>
  );
}

function NewFloorForm({ siteId }: { siteId: number }) {
  const refresh = useRefresh();
  const [feedback, setFeedback] = useState<Feedback>(null);
  const form = useForm<FloorCreateInput>({ resolver: zodResolver(floorCreateSchema), defaultValues: { siteId, name: "", level: 0 } });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      aria-label="New floor"
      className="flex flex-wrap items-end gap-2 rounded-md border border-stone-200 p-3"
      onSubmit={form.handleSubmit(async (values) => {
        try {
          await apiFetch("/api/floors", { body: values });
          form.reset({ siteId, name: "", level: 0 });
          setFeedback({ kind: "ok", text: `Floor ${values.name} added.` });
          refresh();
        } catch (error) {
          setFeedback({ kind: "error", text: messageOf(error) });
        }
      })}
    >
      <Field id={`new-floor-name-${siteId}`} label="New floor" error={errors.name?.message}>
        <input id={`new-floor-name-${siteId}`} className="field-input" placeholder="e.g. Second floor" {...form.register("name")} />
      </Field>
      <Field id={`new-floor-level-${siteId}`} label="Level" error={errors.level?.message}>
        <input id={`new-floor-level-${siteId}`} className="field-input w-24" inputMode="numeric" {...form.register("level")} />
      </Field>
      <button type="submit" className="button" disabled={form.formState.isSubmitting}>Add floor</button>
      <FeedbackLine feedback={feedback} />
    </form>
  );
}

function NewRoomForm({ floorId, floorName }: { floorId: number; floorName: string }) {
  const router = useRouter();
  const [feedback, setFeedback] = useState<Feedback>(null);
  const form = useForm<RoomCreateInput>({ resolver: zodResolver(roomCreateSchema), defaultValues: { floorId, name: "", width: 10, depth: 8, obstacles: [] } });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      aria-label={`New room on ${floorName}`}
      className="flex flex-wrap items-end gap-2 rounded-md border border-stone-200 p-3"
      onSubmit={form.handleSubmit(async (values) => {
        try {
          const { room } = await apiFetch<{ room: { id: number } }>("/api/rooms", { body: values });
          router.push(`/galleries/${room.id}`);
        } catch (error) {
          setFeedback({ kind: "error", text: messageOf(error) });
        }
      })}
    >
      <Field id={`new-room-name-${floorId}`} label={`New room on ${floorName}`} error={errors.name?.message}>
        <input id={`new-room-name-${floorId}`} className="field-input" placeholder="e.g. Print Room" {...form.register("name")} />
      </Field>
      <Field id={`new-room-width-${floorId}`} label="Width (m)" error={errors.width?.message}>
        <input id={`new-room-width-${floorId}`} className="field-input w-24" inputMode="decimal" {...form.register("width")} />
      </Field>
      <Field id={`new-room-depth-${floorId}`} label="Depth (m)" error={errors.depth?.message}>
        <input id={`new-room-depth-${floorId}`} className="field-input w-24" inputMode="decimal" {...form.register("depth")} />
      </Field>
      <button type="submit" className="button" disabled={form.formState.isSubmitting}>Add room and draw it</button>
      <FeedbackLine feedback={feedback} />
    </form>
  );
}

function NewSiteForm() {
  const refresh = useRefresh();
  const [feedback, setFeedback] = useState<Feedback>(null);
  const blank: SiteCreateInput = { name: "", timeZone: "Europe/Berlin", currency: "EUR", hourlyRate: 22 };
  const form = useForm<SiteCreateInput>({ resolver: zodResolver(siteCreateSchema), defaultValues: blank });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      aria-label="New site"
      className="card space-y-3"
      onSubmit={form.handleSubmit(async (values) => {
        try {
          await apiFetch("/api/sites", { body: values });
          form.reset(blank);
          setFeedback({ kind: "ok", text: `Site ${values.name} added.` });
          refresh();
        } catch (error) {
          setFeedback({ kind: "error", text: messageOf(error) });
        }
      })}
    >
      <h2 className="text-lg">New site</h2>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="new-site-name" label="Name" error={errors.name?.message}>
          <input id="new-site-name" className="field-input" {...form.register("name")} />
        </Field>
        <Field id="new-site-zone" label="Time zone" error={errors.timeZone?.message}>
          <input id="new-site-zone" className="field-input" {...form.register("timeZone")} />
        </Field>
        <Field id="new-site-currency" label="Currency (ISO 4217)" error={errors.currency?.message}>
          <input id="new-site-currency" className="field-input" {...form.register("currency")} />
        </Field>
        <Field id="new-site-rate" label="Hourly rate of a guard" error={errors.hourlyRate?.message}>
          <input id="new-site-rate" className="field-input" inputMode="decimal" {...form.register("hourlyRate")} />
        </Field>
      </div>
      <button type="submit" className="button" disabled={form.formState.isSubmitting}>Add site</button>
      <FeedbackLine feedback={feedback} />
    </form>
  );
}

function Field({ id, label, error, children }: { id: string; label: string; error?: string; children: ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">{label}</label>
      {children}
      {error && (
        <p role="alert" className="text-sm text-alert-700" id={`${id}-error`}>
          {error}
        </p>
      )}
    </div>
  );
}
