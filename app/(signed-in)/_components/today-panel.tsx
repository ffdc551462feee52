import { formatDay, type SiteFormat } from "@/lib/format";
import { describeOpening, type FloorWithRooms, type SiteDay } from "../_queries/site";

export function TodayPanel({ siteName, day, floors, format }: { siteName: string; day: SiteDay; floors: FloorWithRooms[]; format: SiteFormat }) {
  const roomCount = floors.reduce((sum, floor) => sum + floor.rooms.length, 0);
  return (
    <section aria-labelledby="today" className="card">
      <h2 id="today">Today at {siteName}</h2>
      <p className="mt-1 text-sm text-stone-700">
        {formatDay(format, day.date)} ({format.timeZone})
      </p>
      <p className="mt-3 text-lg">
        Opening hours: <strong>{describeOpening(day.opening, format)}</strong>
        {day.exception && <span className="ml-2 tag">special day</span>}
      </p>
      {day.opening ? (
        <>
          <p className="mt-3">
            {roomCount} rooms open on {floors.length} floors:
          </p>
          <ul className="mt-2 space-y-2">
            {floors.map((floor) => (
              <li key={floor.id}>
                <span className="font-semibold">{floor.name}</span>
                <span className="text-stone-700">: {floor.rooms.map((room) => room.name).join(", ") || "no rooms"}</span>
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="mt-3">The site is closed today: no rooms are open.</p>
      )}
    </section>
  );
}
