import type { Metadata } from "next";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { UsersTable } from "./_components/users-table";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const admin = await requirePageUser("users:manage");
  const users = await db.selectFrom("users").select(["id", "email", "name", "role"]).orderBy("role").orderBy("name").execute();
  return (
    <div className="space-y-4">
      <div>
        <h1>Users</h1>
        <p className="text-stone-700">{users.length} accounts. A role decides which pages and actions a person has; a change counts from their next request.</p>
      </div>
      <UsersTable users={users} currentUserId={admin.id} />
    </div>
  );
}
