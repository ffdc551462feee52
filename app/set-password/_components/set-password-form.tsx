"use client";
// The password a person chooses through their mailed link, typed twice; then on to sign in.
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { newPasswordSchema } from "@/lib/api/accounts";

const formSchema = z
  .object({ password: newPasswordSchema.shape.password, again: z.string() })
  .refine((v) => v.password === v.again, { message: "the two passwords differ; type the same one twice", path: ["again"] });
type FormValues = z.infer<typeof formSchema>;

export function SetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<FormValues>({ resolver: zodResolver(formSchema), defaultValues: { password: "", again: "" } });
  const errors = form.formState.errors;
  if (done) {
    return (
      <p role="status">
        Your password is set for {done}. <Link href="/sign-in">Sign in</Link>.
      </p>
    );
  }
  return (
    <form
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit(async (values) => {
        setProblem(null);
        try {
          const { email } = await apiFetch<{ email: string }>("/api/auth/set-password", { body: { token, password: values.password } });
          setDone(email);
        } catch (error) {
          setProblem(error instanceof ApiRequestError ? error.message : "The password could not be set; try again.");
        }
      })}
    >
      <div>
        <label htmlFor="new-password" className="field-label">New password</label>
        <input id="new-password" type="password" autoComplete="new-password" className="field-input" aria-invalid={errors.password ? true : undefined} {...form.register("password")} />
        {errors.password && <p role="alert" className="text-sm text-alert-700">{errors.password.message}</p>}
      </div>
      <div>
        <label htmlFor="new-password-again" className="field-label">The same password again</label>
        <input id="new-password-again" type="password" autoComplete="new-password" className="field-input" aria-invalid={errors.again ? true : undefined} {...form.register("again")} />
        {errors.again && <p role="alert" className="text-sm text-alert-700">{errors.again.message}</p>}
      </div>
      <button type="submit" className="button w-full" disabled={form.formState.isSubmitting}>Set password</button>
      {problem && <p role="alert" className="text-sm text-alert-700">{problem}</p>}
    </form>
  );
}
