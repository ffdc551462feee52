"use client";
import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/sign-in" })}
      className="inline-flex min-h-[2.75rem] items-center rounded-md border border-ink-500 px-3 text-sm font-semibold text-stone-50 hover:bg-ink-700"
    >
      Sign out
    </button>
  );
}
