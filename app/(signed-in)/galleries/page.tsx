import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/lib/auth/session";
import { RoomOutline } from "@/components/room-outline";
import { floorsWithRooms, mainSite } from "../_queries/site";

export const metadata: Metadata = { title: "Galleries" };

export default async function GalleriesPage() {
  await requirePageUser("galleries:view");
  const site = await mainSite();
  const floors = site ? await floorsWithRooms(site.id) : [];
  return (
    <div className="space-y-6">
      <div>
        <h1>Galleries</h1>
        <p className="text-stone-700">
          {site ? `${site.name}: ` : ""}floors and rooms, with the corners (vertices) and obstacles each outline has.
        </p>
      </div>
      {floors.length === 0 && <p>No floors yet.</p>}
      {floors.map((floor) => (
        <section key={floor.id} aria-labelledby={`floor-${floor.id}`}>
          <h2 id={`floor-${floor.id}`}>
            {floor.name} <span className="text-base font-normal text-stone-600">(level {floor.level})</span>
          </h2>
          <ul className="mt-3 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {floor.rooms.map((room) => (
              <li key={room.id} className="card flex items-center gap-4">
                <RoomOutline outline={room.outline} obstacles={room.obstacles} label={`Outline of ${room.name}`} />
                <div>
                  <h3>
                    <Link href={`/galleries/${room.id}`}>{room.name}</Link>
                  </h3>
                  <dl className="mt-1 grid grid-cols-[auto_auto] gap-x-3 text-sm">
                    <dt className="text-stone-700">Vertices</dt>
                    <dd className="font-semibold">{room.outline.length + room.obstacles.reduce((n, ring) => n + ring.length, 0)}</dd>
                    <dt className="text-stone-700">Obstacles</dt>
                    <dd className="font-semibold">{room.obstacles.length}</dd>
                    <dt className="text-stone-700">Version</dt>
                    <dd>{room.version}</dd>
                  </dl>
                </div>
              </li>
            ))}
            {floor.rooms.length === 0 && <li>No rooms on this floor.</li>}
          </ul>
        </section>
      ))}
    </div>
  );
}
