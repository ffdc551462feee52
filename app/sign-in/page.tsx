import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { sessionUser } from "@/lib/auth/session";
import { safeCallbackPath } from "@/lib/auth/callback-url";
import { SignInForm } from "./_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };


export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  // A callbackUrl from the address bar is only followed to our own pages, never to another site.
  const callbackUrl = safeCallbackPath(params.callbackUrl);
  if (await sessionUser()) redirect(callbackUrl);
  return (
    <main id="main" className="flex min-h-screen items-center justify-center bg-ink-800 px-4 py-section">
      <div className="w-full max-w-md">
        <p className="mb-4 text-center text-3xl font-bold tracking-tight text-stone-50">
          <span aria-hidden="true" className="mr-2 text-brass-300">◎</span>Sightward
        </p>
        <div className="card">
          <h1 className="mb-1">Sign in</h1>
          <p className="mb-6 text-sm text-stone-700">Posts, staffing and rosters for the museum&apos;s security team.</p>
          <SignInForm callbackUrl={callbackUrl} initialError={params.error === "CredentialsSignin"} />
        </div>
      </div>
    </main>
  );
}
