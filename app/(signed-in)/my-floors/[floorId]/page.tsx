import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { guardByUserId } from "@/db/queries/rosters";
import { floorIdParams } from "@/lib/api/galleries";
import { requirePageUser } from "@/lib/auth/session";
import { floorMapSheet } from "@/lib/galleries/floor-map-source";
import { ownPostsAndFloors } from "@/lib/galleries/own-posts";

export const metadata: Metadata = { title: "Floor map" };
export const dynamic = "force-dynamic";

// A guard's map of a floor where they have a shift now or to come, their own posts marked; other
// floors are not theirs to open (404).
export default async function GuardFloorMapPage({ params }: { params: Promise<{ floorId: string }> }) {
  const user = await requirePageUser("shifts:own");
  const parsed = floorIdParams.safeParse(await params);
  if (!parsed.success) notFound();
  const guard = await guardByUserId(db, user.id);
  if (!guard) notFound();
  const own = await ownPostsAndFloors(db, guard.id);
  if (!own.floors.some((f) => f.id === parsed.data.floorId)) notFound();
  const sheet = await floorMapSheet(db, parsed.data.floorId, own.posts);
  if (!sheet) notFound();
  return (
    <div className="space-y-4">
      <p className="print:hidden">
        <Link href="/my-shifts">← My shifts</Link>
      </p>
      <div>
        <h1>Floor map: {sheet.floor.name}</h1>
        <p className="text-stone-700">Your posts on this floor are marked in gold with their number. Posts never block exits or evacuation routes.</p>
      </div>
      {/* Our own SVG, built from stored numbers with every text escaped (lib/galleries/floor-map.ts). */}
      <div className="card overflow-x-auto" data-testid="floor-map" dangerouslySetInnerHTML={{ __html: sheet.inlineSvg }} />
    </div>
  );
}
