"use client";
import "./globals.css";
import { ErrorPanel } from "@/components/error-panel";

// Last resort when the root layout itself fails.
export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body>
        <main id="main" className="px-4">
          <ErrorPanel reset={reset} />
        </main>
      </body>
    </html>
  );
}
