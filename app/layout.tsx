import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import "./globals.css";
import { sightwardSans } from "./fonts";
import { QueryProvider } from "@/components/query-provider";

export const metadata: Metadata = {
  title: { default: "Sightward", template: "%s · Sightward" },
  description: "Guard posts from gallery outlines, hourly staffing under labour rules, rosters in every guard's hands.",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: "#113836",
};

// The root layout touches no database, so a PostgreSQL outage still renders our error page.
// Every page renders per request: Next.js puts the proxy's CSP nonce on its scripts only then.
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  return (
    <html lang="en" className={sightwardSans.variable}>
      <body>
        <QueryProvider>{children}</QueryProvider>
      </body>
    </html>
  );
}
