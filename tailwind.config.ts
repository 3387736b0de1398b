import type { Config } from "tailwindcss";

// Loopshift's own palette: "flux" is the deep blue-green of the brand, "coil" the copper accent
// (the colour of a winding), "steel" the neutrals. Text colours on their backgrounds meet WCAG AA.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        flux: {
          50: "#eef7f6",
          100: "#d5ecea",
          200: "#acd8d4",
          300: "#78bdb8",
          400: "#4a9e99",
          500: "#2f827e",
          600: "#236865",
          700: "#1d5452",
          800: "#184341",
          900: "#123433",
          950: "#0a2020",
        },
        coil: {
          50: "#fdf5ee",
          100: "#f9e5d2",
          200: "#f2c8a3",
          300: "#e9a46d",
          400: "#df8142",
          500: "#c8652a",
          600: "#a94f21",
          700: "#873d1e",
          800: "#6c321d",
          900: "#582a1b",
        },
        steel: {
          50: "#f6f7f8",
          100: "#eceef0",
          200: "#d6dadf",
          300: "#b3bac3",
          400: "#8a94a1",
          500: "#6b7685",
          600: "#555e6c",
          700: "#464d58",
          800: "#3c424b",
          900: "#22262c",
          950: "#15181c",
        },
        caution: { 50: "#fff8e6", 600: "#8a5a00", 700: "#6e4700" },
        danger: { 50: "#fdeeee", 600: "#b42323", 700: "#931b1b" },
        success: { 50: "#ecf8f0", 600: "#1f7a44", 700: "#17613a" },
      },
      fontFamily: {
        sans: ["Lato", "ui-sans-serif", "system-ui", "sans-serif"],
        mono: ["ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
      },
      // A modular type scale (ratio 1.2 from 15 px body text).
      fontSize: {
        caption: ["0.75rem", { lineHeight: "1rem" }],
        small: ["0.8125rem", { lineHeight: "1.25rem" }],
        body: ["0.9375rem", { lineHeight: "1.5rem" }],
        lead: ["1.125rem", { lineHeight: "1.65rem" }],
        title: ["1.35rem", { lineHeight: "1.85rem" }],
        headline: ["1.62rem", { lineHeight: "2.1rem" }],
        display: ["1.94rem", { lineHeight: "2.4rem" }],
      },
      borderRadius: { panel: "0.625rem" },
      boxShadow: { panel: "0 1px 2px rgb(18 52 51 / 0.06), 0 4px 14px rgb(18 52 51 / 0.06)" },
    },
  },
};

export default config;
