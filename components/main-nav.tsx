"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";
import type { NavEntry } from "@/lib/auth/roles";

// The role's navigation; the current page is marked for screen readers and by colour.
export function MainNav({ entries }: { entries: Pick<NavEntry, "href" | "label">[] }) {
  const pathname = usePathname();
  const all = [{ href: "/", label: "Home" }, ...entries];
  return (
    <nav aria-label="Main" className="bg-ink-900">
      <ul className="mx-auto flex max-w-page flex-wrap gap-1 px-4 py-1">
        {all.map((entry) => {
          const current = entry.href === "/" ? pathname === "/" : pathname === entry.href || pathname.startsWith(entry.href + "/");
          return (
            <li key={entry.href}>
              <Link
                href={entry.href}
                aria-current={current ? "page" : undefined}
                className={
                  "inline-flex min-h-[2.75rem] items-center rounded-md px-3 font-semibold no-underline " +
                  (current ? "bg-stone-50 text-ink-900" : "text-stone-100 hover:bg-ink-700")
                }
              >
                {entry.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
