import { idParam } from "@/lib/api/ids";
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { currentRoomExhibition, roomDetail } from "@/db/queries/rooms";
import { postPlansForRoom } from "@/db/queries/post-plans";
import { can } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { CAUTIONS } from "@/components/cautions";
import { SiteFormatProvider } from "@/components/site-format";
import { formatDate, siteFormat } from "@/lib/format";
import { siteDay } from "../../_queries/site";
import { RoomWorkspace } from "./_components/room-workspace";

export const dynamic = "force-dynamic";

type Params = { params: Promise<{ roomId: string }> };

async function load(roomIdText: string) {
  const parsed = idParam("roomId").safeParse(roomIdText);
  if (!parsed.success) return null;
  const roomId = parsed.data;
  return roomDetail(roomId, db);
}

export async function generateMetadata({ params }: Params): Promise<Metadata> {
  const room = await load((await params).roomId).catch(() => null);
  return { title: room ? room.name : "Room" };
}

export default async function RoomPage({ params }: Params) {
  const user = await requirePageUser("galleries:view");
  const room = await load((await params).roomId);
  if (!room) notFound();
  const plans = await postPlansForRoom(room.id, undefined, db);
  const today = siteDay(room.site).date;
  const exhibition = currentRoomExhibition(room.exhibitions, today);
  // The two cautions about post plans (the third is about labour rules, shown with rosters).
  const planCautions = CAUTIONS.slice(0, 2);
  const f = siteFormat(room.site);
  return (
    // The room's own site decides how its dates and money read.
    <SiteFormatProvider value={f}>
      <div className="space-y-6">
        <div className="space-y-1">
          <p className="text-sm">
            <Link href="/galleries">Galleries</Link> / {room.floor.name}
          </p>
          <h1>{room.name}</h1>
          <p className="text-stone-700">
            Version {room.version}, last changed {formatDate(f, room.updated_at)}
            {exhibition ? (
              <>
                {" "}
                · in <span className="font-semibold">{exhibition.name}</span> ({exhibition.risk_level} risk)
              </>
            ) : null}
          </p>
        </div>
        <RoomWorkspace
          initial={{ room, plans }}
          canEdit={can(user.role, "rooms:edit")}
          canApprove={can(user.role, "plans:approve")}
          exhibitionId={exhibition?.id ?? null}
          cautions={
            <section aria-labelledby="plan-cautions" className="rounded-card border border-brass-300 bg-brass-100 p-gutter text-sm text-stone-900">
              <h2 id="plan-cautions" className="mb-1 text-base">
                Before you rely on this plan
              </h2>
              <ul className="list-disc space-y-1 pl-5">
                {planCautions.map((caution) => (
                  <li key={caution}>{caution}</li>
                ))}
              </ul>
            </section>
          }
        />
      </div>
    </SiteFormatProvider>
  );
}
