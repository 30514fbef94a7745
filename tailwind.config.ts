import type { Config } from "tailwindcss";

/**
 * LoopLedger design tokens. A cool slate ground, a deep "basin" teal for the wet loops, a copper accent
 * for money and warnings in amber; numbers set in the mono face with tabular figures.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#17222b", soft: "#3d4b57", faint: "#6b7a86" },
        paper: { DEFAULT: "#f6f8f9", raised: "#ffffff", sunk: "#e9eef1" },
        line: { DEFAULT: "#d3dce2", strong: "#a9b7c1" },
        basin: { 50: "#eaf6f6", 100: "#cdeaea", 300: "#7cc4c6", 500: "#1f8a8f", 600: "#157277", 700: "#0f5a5e", 900: "#0a3436" },
        copper: { 100: "#f7e6da", 400: "#d9854a", 500: "#bf6a2e", 700: "#86461b" },
        caution: { 50: "#fff7e6", 200: "#fbd98a", 600: "#a86a00", 800: "#6b4300" },
        danger: { 50: "#fdecec", 600: "#b42323", 700: "#8f1b1b" },
        ok: { 50: "#e9f6ee", 600: "#1f7a45" },
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        "2xs": ["0.6875rem", { lineHeight: "1rem" }],
        xs: ["0.75rem", { lineHeight: "1.1rem" }],
        sm: ["0.875rem", { lineHeight: "1.35rem" }],
        base: ["0.9375rem", { lineHeight: "1.5rem" }],
        lg: ["1.125rem", { lineHeight: "1.65rem" }],
        xl: ["1.375rem", { lineHeight: "1.85rem" }],
        "2xl": ["1.75rem", { lineHeight: "2.2rem" }],
      },
      spacing: { gutter: "1.25rem", panel: "1.5rem", rail: "15rem" },
      borderRadius: { panel: "0.5rem" },
      boxShadow: { panel: "0 1px 2px rgba(23,34,43,0.06), 0 1px 1px rgba(23,34,43,0.04)" },
    },
  },
};

export default config;
