import type { Metadata } from "next";
import { db } from "@/db";
import { galleriesTree } from "@/db/queries/galleries";
import { requirePageUser } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { GalleriesManager } from "./_components/galleries-manager";

export const metadata: Metadata = { title: "Galleries" };
export const dynamic = "force-dynamic";

export default async function GalleriesPage() {
  const user = await requirePageUser("galleries:view");
  const sites = await galleriesTree(db);
  const editable = can(user.role, "rooms:edit");
  return (
    <div className="space-y-6">
      <div>
        <h1>Galleries</h1>
        <p className="text-stone-700">
          Sites, floors and rooms, with the corners (vertices) and obstacles each outline has.
          {editable ? " Add, rename, reorder and delete them here; open a room to draw its walls." : ""}
        </p>
      </div>
      <GalleriesManager sites={sites} editable={editable} />
    </div>
  );
}
