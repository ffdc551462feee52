import { formatDateRange, type SiteFormat } from "@/lib/format";
import type { ExhibitionWithRooms } from "../_queries/site";

export function ExhibitionPanel({ current, format }: { current: { exhibition: ExhibitionWithRooms; running: boolean } | null; format: SiteFormat }) {
  return (
    <section aria-labelledby="exhibition" className="card">
      <h2 id="exhibition">{current?.running === false ? "Next exhibition" : "Current exhibition"}</h2>
      {current ? (
        <>
          <p className="mt-2 text-lg font-semibold">{current.exhibition.name}</p>
          <p className="text-sm text-stone-700">
            {formatDateRange(format, current.exhibition.starts_on, current.exhibition.ends_on)}
          </p>
          <ul className="mt-3 space-y-1">
            {current.exhibition.rooms.map((room) => (
              <li key={room.id} className="flex flex-wrap items-center gap-2">
                <span>{room.name}</span>
                <span className="text-sm text-stone-600">({room.floor})</span>
                <span className={room.risk_level === "high" ? "tag-high" : "tag"}>{room.risk_level} risk</span>
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="mt-2">No exhibition is running or planned.</p>
      )}
    </section>
  );
}
