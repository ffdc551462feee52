"use client";
// Inviting a person: name, e-mail and role; they get a single-use link (7 days) to choose a password.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { inviteSchema, type InviteInput } from "@/lib/api/accounts";
import { ROLE_LABELS, ROLE_NAMES } from "@/lib/auth/roles";

export function InviteForm() {
  const router = useRouter();
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const blank: InviteInput = { name: "", email: "", role: "guard" };
  const form = useForm<InviteInput>({ resolver: zodResolver(inviteSchema), defaultValues: blank });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      aria-label="Invite a person"
      className="card space-y-3"
      onSubmit={form.handleSubmit(async (values) => {
        setMessage(null);
        try {
          const answer = await apiFetch<{ user: { email: string }; warning?: string }>("/api/users", { body: values });
          form.reset(blank);
          setMessage(answer.warning ? { kind: "error", text: answer.warning } : { kind: "ok", text: `Invitation sent to ${answer.user.email}; the link works once, for 7 days.` });
          router.refresh();
        } catch (error) {
          setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The invitation could not be sent; try again." });
        }
      })}
    >
      <h2 className="text-lg">Invite a person</h2>
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor="invite-name" className="field-label">Name</label>
          <input id="invite-name" className="field-input" {...form.register("name")} aria-invalid={errors.name ? true : undefined} />
          {errors.name && <p role="alert" className="text-sm text-alert-700">{errors.name.message}</p>}
        </div>
        <div>
          <label htmlFor="invite-email" className="field-label">E-mail</label>
          <input id="invite-email" type="email" className="field-input" {...form.register("email")} aria-invalid={errors.email ? true : undefined} />
          {errors.email && <p role="alert" className="text-sm text-alert-700">{errors.email.message}</p>}
        </div>
        <div>
          <label htmlFor="invite-role" className="field-label">Role</label>
          <select id="invite-role" className="field-input" {...form.register("role")}>
            {ROLE_NAMES.map((role) => (
              <option key={role} value={role}>{ROLE_LABELS[role]}</option>
            ))}
          </select>
        </div>
      </div>
      <button type="submit" className="button" disabled={form.formState.isSubmitting}>Send invitation</button>
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "text-sm text-alert-700" : "text-sm text-ok-700"}>
          {message.text}
        </p>
      )}
    </form>
  );
}
