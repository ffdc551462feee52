import type { Metadata } from "next";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { UsersTable } from "./_components/users-table";
import { InviteForm } from "./_components/invite-form";
import { listUsers } from "@/db/queries/accounts";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const admin = await requirePageUser("users:manage");
  const users = (await listUsers(db)).map((u) => ({ ...u, disabled_at: u.disabled_at?.toISOString() ?? null, last_sign_in_at: u.last_sign_in_at?.toISOString() ?? null }));
  return (
    <div className="space-y-4">
      <div>
        <h1>Users</h1>
        <p className="text-stone-700">{users.length} accounts. A role decides which pages and actions a person has; a change, or disabling an account, counts from their next request.</p>
      </div>
      <InviteForm />
      <UsersTable users={users} currentUserId={admin.id} />
    </div>
  );
}
