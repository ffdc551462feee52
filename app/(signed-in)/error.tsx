"use client";
import { ErrorPanel } from "@/components/error-panel";

// Inside the shell: the navigation stays, the page's place shows what went wrong.
export default function PageError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return <ErrorPanel reset={reset} />;
}
