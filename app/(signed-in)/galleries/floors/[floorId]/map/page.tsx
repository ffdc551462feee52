import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { floorIdParams } from "@/lib/api/galleries";
import { requirePageUser } from "@/lib/auth/session";
import { floorMapSheet } from "@/lib/galleries/floor-map-source";
import { MapActions } from "./_components/map-actions";

export const metadata: Metadata = { title: "Floor map" };
export const dynamic = "force-dynamic";

export default async function FloorMapPage({ params }: { params: Promise<{ floorId: string }> }) {
  await requirePageUser("galleries:view");
  const parsed = floorIdParams.safeParse(await params);
  if (!parsed.success) notFound();
  const sheet = await floorMapSheet(db, parsed.data.floorId);
  if (!sheet) notFound();
  const posts = sheet.map.rooms.reduce((n, r) => n + (r.posts?.length ?? 0), 0);
  const unseen = sheet.map.rooms.filter((r) => r.covered !== null && r.covered < 1 - 1e-9).map((r) => r.name);
  const stale = sheet.map.rooms.filter((r) => r.stale).map((r) => r.name);
  return (
    <div className="space-y-4">
      <p className="print:hidden">
        <Link href="/galleries">← Galleries</Link>
      </p>
      <div>
        <h1>Floor map: {sheet.floor.name}</h1>
        <p className="text-stone-700">
          {sheet.exhibition ? `Approved posts for ${sheet.exhibition}` : "No exhibition runs today, so no posts are shown"}: {posts} post{posts === 1 ? "" : "s"} in{" "}
          {sheet.map.rooms.length} room{sheet.map.rooms.length === 1 ? "" : "s"}. Rooms are set side by side at one scale, each in its own frame, not as the
          building stands. Posts never block exits or evacuation routes.
        </p>
        {unseen.length > 0 && <p className="font-semibold text-alert-700">Floor no post sees: {unseen.join(", ")}.</p>}
        {stale.length > 0 && <p className="font-semibold text-alert-700">Approval stale (walls changed since): {stale.join(", ")}; compute and approve new plans.</p>}
      </div>
      <MapActions floorId={sheet.floor.id} fileName={sheet.fileName} />
      {/* Our own SVG, built from stored numbers with every text escaped (lib/galleries/floor-map.ts). */}
      <div className="card floor-map overflow-x-auto print:border-0 print:p-0 print:shadow-none" data-testid="floor-map" dangerouslySetInnerHTML={{ __html: sheet.inlineSvg }} />
    </div>
  );
}
