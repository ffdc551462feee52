"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/api/client";
import { roleChangeSchema, type RoleChange } from "@/lib/api/user-role";
import { ROLE_LABELS, ROLE_NAMES, type Role } from "@/lib/auth/roles";

export interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export function UsersTable({ users, currentUserId }: { users: UserRow[]; currentUserId: number }) {
  return (
    <div className="card overflow-x-auto">
      <table className="data-table">
        <caption className="sr-only">Users and their roles</caption>
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col">E-mail</th>
            <th scope="col">Role</th>
          </tr>
        </thead>
        <tbody>
          {users.map((user) => (
            <tr key={user.id}>
              <td>
                {user.name}
                {user.id === currentUserId && <span className="ml-2 tag">you</span>}
              </td>
              <td>{user.email}</td>
              <td>
                <RoleForm user={user} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function RoleForm({ user }: { user: UserRow }) {
  const router = useRouter();
  // Until the page is interactive the form cannot send anything, so Save waits for it.
  const [interactive, setInteractive] = useState(false);
  useEffect(() => setInteractive(true), []);
  const form = useForm<RoleChange>({ resolver: zodResolver(roleChangeSchema), defaultValues: { role: user.role } });
  const change = useMutation({
    mutationFn: (body: RoleChange) => apiFetch<{ user: UserRow }>(`/api/users/${user.id}`, { method: "PATCH", body }),
    onSuccess: ({ user: saved }) => {
      form.reset({ role: saved.role });
      router.refresh();
    },
  });
  const fieldId = `role-${user.id}`;
  const messageId = `role-message-${user.id}`;
  const problem = form.formState.errors.role?.message ?? (change.error ? change.error.message : null);

  return (
    <form onSubmit={form.handleSubmit((values) => change.mutate(values))} className="flex flex-wrap items-center gap-2">
      <label htmlFor={fieldId} className="sr-only">Role of {user.name}</label>
      <select
        id={fieldId}
        {...form.register("role")}
        aria-describedby={messageId}
        aria-invalid={problem ? true : undefined}
        className="min-h-[2.75rem] rounded-md border border-stone-400 bg-white px-2"
      >
        {ROLE_NAMES.map((role) => (
          <option key={role} value={role}>{ROLE_LABELS[role]}</option>
        ))}
      </select>
      <button type="submit" className="button-quiet" disabled={!interactive || change.isPending}>
        {change.isPending ? "Saving…" : "Save"}
      </button>
      <span id={messageId} role="status" className={problem ? "text-sm font-semibold text-alert-700" : "text-sm text-ok-700"}>
        {problem ?? (change.isSuccess && !form.formState.isDirty ? "Saved" : "")}
      </span>
    </form>
  );
}
