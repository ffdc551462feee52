// Atkinson Hyperlegible Next (SIL Open Font License 1.1, fonts/atkinson-hyperlegible-next/OFL.txt),
// served from our own files: no request leaves the machine.
import localFont from "next/font/local";

export const sightwardSans = localFont({
  src: [
    { path: "../fonts/atkinson-hyperlegible-next/atkinson-hyperlegible-next-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../fonts/atkinson-hyperlegible-next/atkinson-hyperlegible-next-latin-400-italic.woff2", weight: "400", style: "italic" },
    { path: "../fonts/atkinson-hyperlegible-next/atkinson-hyperlegible-next-latin-600-normal.woff2", weight: "600", style: "normal" },
    { path: "../fonts/atkinson-hyperlegible-next/atkinson-hyperlegible-next-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-sightward",
  display: "swap",
  fallback: ["system-ui", "sans-serif"],
});
