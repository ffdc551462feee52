import Link from "next/link";
import { redirect } from "next/navigation";
import { Cautions } from "@/components/cautions";
import { MainNav } from "@/components/main-nav";
import { SignOutButton } from "@/components/sign-out-button";
import { SiteFormatProvider } from "@/components/site-format";
import { ROLE_LABELS, navigationFor } from "@/lib/auth/roles";
import { sessionUser } from "@/lib/auth/session";
import { mainSiteFormat } from "./_queries/site";

// The shell reads only the session token, so it still renders when the database is down; the site's
// format falls back to the defaults then.
export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await sessionUser();
  if (!user) redirect("/sign-in");
  const entries = navigationFor(user.role).map(({ href, label }) => ({ href, label }));
  const format = await mainSiteFormat();
  return (
    <SiteFormatProvider value={format}>
      <div className="flex min-h-screen flex-col">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2">
          Skip to content
        </a>
        <header className="bg-ink-800 text-stone-50 print:hidden">
          <div className="mx-auto flex max-w-page flex-wrap items-center justify-between gap-3 px-4 py-3">
            <Link href="/" className="text-xl font-bold text-stone-50 no-underline">
              <span aria-hidden="true" className="mr-1 text-brass-300">◎</span>Sightward
            </Link>
            <div className="flex items-center gap-3 text-sm">
              <span>
                <span className="font-semibold">{user.name}</span>
                <span className="ml-2 rounded-full bg-ink-600 px-2 py-0.5 text-xs">{ROLE_LABELS[user.role]}</span>
              </span>
              <SignOutButton />
            </div>
          </div>
          <MainNav entries={entries} />
        </header>
        <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-4 py-6">
          {children}
        </main>
        <Cautions />
      </div>
    </SiteFormatProvider>
  );
}
