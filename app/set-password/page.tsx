import type { Metadata } from "next";
import { SetPasswordForm } from "./_components/set-password-form";

export const metadata: Metadata = { title: "Choose your password" };

/** Opened from an invitation or reset mail: the token in the address is the proof, no sign-in needed. */
export default async function SetPasswordPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const token = typeof params.token === "string" ? params.token : "";
  return (
    <main id="main" className="flex min-h-screen items-center justify-center bg-ink-800 px-4 py-section">
      <div className="w-full max-w-md">
        <p className="mb-4 text-center text-3xl font-bold tracking-tight text-stone-50">
          <span aria-hidden="true" className="mr-2 text-brass-300">◎</span>Sightward
        </p>
        <div className="card">
          <h1 className="mb-1">Choose your password</h1>
          <p className="mb-6 text-sm text-stone-700">At least 12 characters. The link in your mail works once.</p>
          {token ? <SetPasswordForm token={token} /> : <p role="alert" className="text-alert-700">This address has no link token; open the link from your mail again.</p>}
        </div>
      </div>
    </main>
  );
}
