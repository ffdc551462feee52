import type { Metadata } from "next";
import Link from "next/link";
import { postPlansForExhibition } from "@/db/queries/post-plans";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateRange, formatNumber, siteFormat } from "@/lib/format";
import { exhibitionsWithRooms, mainSite, siteDay } from "../_queries/site";
import { db } from "@/db";
import { roomsOfSite } from "@/db/queries/exhibitions";
import { can } from "@/lib/auth/roles";
import { ExhibitionEditor } from "./_components/exhibition-form";

export const metadata: Metadata = { title: "Exhibitions" };

export default async function ExhibitionsPage() {
  const user = await requirePageUser("exhibitions:view");
  const editable = can(user.role, "exhibitions:edit");
  const site = await mainSite();
  const exhibitions = site ? await exhibitionsWithRooms(site.id) : [];
  // Each exhibition's post plans, newest first per room: the first approved one is what staffing counts.
  const plans = new Map(await Promise.all(exhibitions.map(async (e) => [e.id, await postPlansForExhibition(e.id)] as const)));
  const today = site ? siteDay(site).date : "";
  const f = siteFormat(site);
  const siteRooms = site && editable ? await roomsOfSite(db, site.id) : [];
  return (
    <div className="space-y-6">
      <h1>Exhibitions</h1>
      {site && editable && (
        <section aria-label="New exhibition" className="card">
          <ExhibitionEditor siteId={site.id} siteRooms={siteRooms} initial={null} today={today} />
        </section>
      )}
      {exhibitions.length === 0 && <p>No exhibitions yet.</p>}
      {exhibitions.map((exhibition) => {
        const state = exhibition.ends_on < today ? "ended" : exhibition.starts_on > today ? "upcoming" : "running";
        return (
          <section key={exhibition.id} aria-labelledby={`exhibition-${exhibition.id}`} className="card">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 id={`exhibition-${exhibition.id}`}>{exhibition.name}</h2>
              <span className="tag">{state}</span>
            </div>
            <p className="text-sm text-stone-700">
              {formatDateRange(f, exhibition.starts_on, exhibition.ends_on)}
            </p>
            {site && editable && (
              <div className="mt-3">
                <ExhibitionEditor
                  siteId={site.id}
                  siteRooms={siteRooms}
                  today={today}
                  initial={{
                    id: exhibition.id,
                    name: exhibition.name,
                    startsOn: exhibition.starts_on,
                    endsOn: exhibition.ends_on,
                    rooms: exhibition.rooms.map((r) => ({ roomId: r.id, riskLevel: r.risk_level === "high" ? "high" : "standard", sightRange: r.sight_range == null ? null : Number(r.sight_range), doubleCover: r.double_cover })),
                  }}
                />
              </div>
            )}
            <div className="mt-3 overflow-x-auto">
              <table className="data-table">
                <caption className="sr-only">Rooms of {exhibition.name}</caption>
                <thead>
                  <tr>
                    <th scope="col">Room</th>
                    <th scope="col">Floor</th>
                    <th scope="col">Risk</th>
                    <th scope="col">Sight range</th>
                    <th scope="col">Double cover</th>
                    <th scope="col">Post plan</th>
                  </tr>
                </thead>
                <tbody>
                  {exhibition.rooms.map((room) => (
                    <tr key={room.id}>
                      <td>{room.name}</td>
                      <td>{room.floor}</td>
                      <td>
                        <span className={room.risk_level === "high" ? "tag-high" : "tag"}>{room.risk_level}</span>
                      </td>
                      <td>{room.sight_range == null ? "unlimited" : `${formatNumber(f, Number(room.sight_range))} m`}</td>
                      <td>{room.double_cover ? "yes" : "no"}</td>
                      <td>
                        <PlanCell roomId={room.id} plans={(plans.get(exhibition.id) ?? []).filter((p) => p.room_id === room.id)} />
                      </td>
                    </tr>
                  ))}
                  {exhibition.rooms.length === 0 && (
                    <tr>
                      <td colSpan={6}>No rooms assigned yet.</td>
                    </tr>
                  )}
                </tbody>
              </table>
            </div>
          </section>
        );
      })}
    </div>
  );
}

/** The approved plan staffing counts (posts, whether the walls changed since) and any newer proposal. */
function PlanCell({ roomId, plans }: { roomId: number; plans: Awaited<ReturnType<typeof postPlansForExhibition>> }) {
  const approved = plans.find((p) => p.status === "approved");
  const proposed = plans.filter((p) => p.status === "proposed" && (!approved || p.created_at > approved.created_at)).length;
  return (
    <Link href={`/galleries/${roomId}`}>
      {approved ? `${approved.posts.length} posts, approved` : "none approved"}
      {approved && approved.room_version !== approved.current_room_version ? (
        <>
          {" "}
          <span className="tag-high">approval stale</span> the walls changed since; compute and approve a new plan
        </>
      ) : (
        ""
      )}
      {proposed > 0 ? `; ${proposed} proposed` : ""}
    </Link>
  );
}
