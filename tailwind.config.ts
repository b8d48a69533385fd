import type { Config } from "tailwindcss";

/**
 * Coatwright's own look: a deep ink base, neutral "primer" greys for surfaces and text,
 * and a raspberry "candy" accent for the main actions. "flake" (gold) marks things coming due.
 * Text colours are chosen for WCAG AA on the surfaces they sit on (body text ≥ 4.5:1).
 */
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: {
          50: "#eef0f8",
          100: "#dde1f0",
          200: "#c7cde8",
          300: "#9aa3c7",
          400: "#6f79a3",
          500: "#4d5683",
          600: "#363f6b",
          700: "#262e55",
          800: "#1b2244",
          900: "#141b38",
          950: "#0b1020",
        },
        primer: {
          50: "#f7f6f3",
          100: "#eeece7",
          200: "#dedbd3",
          300: "#c6c2b8",
          400: "#a19c90",
          500: "#7d786d",
          600: "#5f5b53",
          700: "#48453f",
          800: "#312f2b",
          900: "#1f1e1b",
        },
        candy: {
          50: "#fff1f5",
          100: "#ffdde8",
          200: "#ffbcd2",
          300: "#ff8ab3",
          400: "#f7508a",
          500: "#e42a6b",
          600: "#c0134f",
          700: "#a30f44",
          800: "#820c37",
          900: "#5e0927",
          950: "#3a0517",
        },
        flake: {
          50: "#fffaeb",
          100: "#fff4d6",
          200: "#ffe6a3",
          300: "#f5c451",
          400: "#e8ad24",
          500: "#d99a0b",
          600: "#ad7604",
          700: "#8a5a00",
          800: "#6b4500",
          900: "#4d3200",
        },
      },
      fontFamily: {
        sans: ["Inter Variable", "ui-sans-serif", "system-ui", "-apple-system", "Segoe UI", "Roboto", "sans-serif"],
      },
      boxShadow: {
        card: "0 1px 2px rgb(11 16 32 / 0.06), 0 1px 3px rgb(11 16 32 / 0.08)",
        raised: "0 4px 12px rgb(11 16 32 / 0.12), 0 2px 4px rgb(11 16 32 / 0.08)",
      },
    },
  },
} satisfies Config;
