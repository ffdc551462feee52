"use client";
import { ErrorPanel } from "@/components/error-panel";

export default function RootError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main id="main" className="px-4">
      <ErrorPanel reset={reset} />
    </main>
  );
}
