"use client";
import { signIn } from "next-auth/react";
import { useEffect, useState } from "react";
import { DISABLED_MESSAGE, THROTTLED_PREFIX } from "@/lib/auth/throttle-message";

const WRONG_CREDENTIALS = "That e-mail and password do not match an account. Check both and try again.";

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError: boolean }) {
  const [error, setError] = useState<string | null>(initialError ? WRONG_CREDENTIALS : null);
  const [pending, setPending] = useState(false);
  // The button waits for the page to be interactive, so a password never goes out in a plain form post.
  const [interactive, setInteractive] = useState(false);
  useEffect(() => setInteractive(true), []);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setPending(true);
    setError(null);
    try {
      const result = await signIn("credentials", {
        redirect: false,
        email: String(form.get("email") ?? ""),
        password: String(form.get("password") ?? ""),
        callbackUrl,
      });
      if (!result || result.error || !result.ok) {
        const reason = result?.error ?? "";
        setError(
          reason.startsWith(THROTTLED_PREFIX) || reason === DISABLED_MESSAGE
            ? reason
            : reason === "CredentialsSignin" || !reason
              ? WRONG_CREDENTIALS
              : "Signing in failed: the server did not answer. Try again in a moment.",
        );
        setPending(false);
        return;
      }
      // A full load, so every server component sees the new session cookie.
      window.location.assign(callbackUrl);
    } catch {
      setError("Signing in failed: the server could not be reached. Try again in a moment.");
      setPending(false);
    }
  }

  return (
    <form method="post" onSubmit={submit} noValidate className="space-y-4" aria-describedby={error ? "sign-in-error" : undefined}>
      {error && (
        <p id="sign-in-error" role="alert" className="rounded-md border border-alert-200 bg-alert-50 px-3 py-2 text-sm font-semibold text-alert-700">
          {error}
        </p>
      )}
      <div>
        <label htmlFor="email" className="field-label">E-mail</label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field-input" />
      </div>
      <div>
        <label htmlFor="password" className="field-label">Password</label>
        <input id="password" name="password" type="password" autoComplete="current-password" required className="field-input" />
      </div>
      <button type="submit" className="button w-full" disabled={pending || !interactive}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
