import type { Config } from "tailwindcss";

// Sightward's own design tokens: a deep ink blue-green for structure, warm stone for surfaces,
// brass for attention and a clear focus ring. Contrast pairs are chosen for WCAG 2.2 AA
// (4.5:1 for text): ink-900 on stone-50, stone-50 on ink-800, alert-700 on alert-50.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    colors: {
      transparent: "transparent",
      current: "currentColor",
      white: "#ffffff",
      ink: {
        50: "#eef5f4",
        100: "#d5e6e4",
        200: "#a9cdc9",
        300: "#77aea9",
        400: "#4b8c87",
        500: "#2f706c",
        600: "#215a57",
        700: "#184846",
        800: "#113836",
        900: "#0b2826",
        950: "#061a19",
      },
      stone: {
        50: "#faf7f2",
        100: "#f3eee5",
        200: "#e6ddcf",
        300: "#d3c6b2",
        400: "#b3a18a",
        500: "#8f7d67",
        600: "#6f604e",
        700: "#54483b",
        800: "#3a3229",
        900: "#231e18",
      },
      brass: {
        100: "#f7ecd0",
        300: "#e2c27a",
        500: "#c0963a",
        700: "#7d5f1c",
      },
      alert: {
        50: "#fbeeec",
        200: "#f0c3bc",
        600: "#b03a2e",
        700: "#8f2c22",
      },
      ok: {
        50: "#ecf6ee",
        700: "#2b6a3a",
      },
      focus: "#e0a526",
    },
    fontFamily: {
      sans: ["var(--font-sightward)", "system-ui", "sans-serif"],
      mono: ["ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
    },
    // Type scale: a 1.2 ratio from a 16 px body, with line heights for reading on a phone.
    fontSize: {
      xs: ["0.75rem", { lineHeight: "1.1rem" }],
      sm: ["0.875rem", { lineHeight: "1.3rem" }],
      base: ["1rem", { lineHeight: "1.55rem" }],
      lg: ["1.2rem", { lineHeight: "1.75rem" }],
      xl: ["1.44rem", { lineHeight: "2rem" }],
      "2xl": ["1.728rem", { lineHeight: "2.25rem" }],
      "3xl": ["2.074rem", { lineHeight: "2.6rem" }],
    },
    extend: {
      // Spacing steps named for layout use on top of Tailwind's 4 px grid.
      spacing: {
        gutter: "1.25rem",
        section: "2.5rem",
        rail: "15rem",
      },
      borderRadius: {
        card: "0.625rem",
      },
      boxShadow: {
        card: "0 1px 2px rgba(11, 40, 38, 0.08), 0 2px 8px rgba(11, 40, 38, 0.06)",
      },
      maxWidth: {
        page: "72rem",
      },
    },
  },
  plugins: [],
};

export default config;
