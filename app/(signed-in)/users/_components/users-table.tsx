"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { useForm } from "react-hook-form";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { formatDateTime } from "@/lib/format";
import { roleChangeSchema, type RoleChange } from "@/lib/api/user-role";
import { ROLE_LABELS, ROLE_NAMES, type Role } from "@/lib/auth/roles";

export interface UserRow {
  id: number;
  email: string;
  name: string;
  role: Role;
  /** ISO time the account was disabled, or null. */
  disabled_at: string | null;
  last_sign_in_at: string | null;
  /** Still waiting for the person to choose a password through their invitation. */
  invited: boolean;
}

export function UsersTable({ users, currentUserId }: { users: UserRow[]; currentUserId: number }) {
  const site = useSiteFormat();
  const when = (iso: string | null) => (iso ? formatDateTime(site, iso) : "never");
  return (
    <div className="card overflow-x-auto">
      <table className="data-table">
        <caption className="sr-only">Users and their roles</caption>
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col">E-mail</th>
            <th scope="col">Role</th>
            <th scope="col">Status</th>
            <th scope="col">Last sign-in</th>
            <th scope="col"><span className="sr-only">Actions</span></th>
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
              <td>
                <span className={user.disabled_at ? "tag-high" : "tag"}>{user.disabled_at ? "disabled" : user.invited ? "invited" : "active"}</span>
              </td>
              <td className="whitespace-nowrap">{when(user.last_sign_in_at)}</td>
              <td>
                <AccountActions user={user} self={user.id === currentUserId} />
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

/** Disable or enable the account, or mail a new link (a reset, or a fresh invitation). */
function AccountActions({ user, self }: { user: UserRow; self: boolean }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const access = useMutation({
    mutationFn: (disabled: boolean) => apiFetch(`/api/users/${user.id}/access`, { method: "PUT", body: { disabled } }),
    onSuccess: (_, disabled) => {
      setMessage({ kind: "ok", text: disabled ? `${user.name} can no longer sign in.` : `${user.name} can sign in again.` });
      router.refresh();
    },
    onError: (error) => setMessage({ kind: "error", text: error.message }),
  });
  const link = useMutation({
    mutationFn: () => apiFetch(`/api/users/${user.id}/reset`, { method: "POST", body: {} }),
    onSuccess: () => setMessage({ kind: "ok", text: `A new link went to ${user.email}.` }),
    onError: (error) => setMessage({ kind: "error", text: error.message }),
  });
  return (
    <div className="flex flex-wrap items-center gap-2">
      {!self && (
        <button type="button" className="button-quiet" disabled={access.isPending} onClick={() => access.mutate(!user.disabled_at)}>
          {user.disabled_at ? `Enable ${user.name}` : `Disable ${user.name}`}
        </button>
      )}
      {!user.disabled_at && (
        <button type="button" className="button-quiet" disabled={link.isPending} onClick={() => link.mutate()}>
          {user.invited ? "Send a new invitation" : "Send a reset link"}
        </button>
      )}
      {message && (
        <span role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "text-sm text-alert-700" : "text-sm text-ok-700"}>
          {message.text}
        </span>
      )}
    </div>
  );
}
