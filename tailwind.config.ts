import type { Config } from "tailwindcss";

/**
 * Getterline's palette: neutral "flash" greys for structure (the silver of a
 * healthy getter), one warm "glow" accent for action and live state (a heater's
 * glow), and "fault" red only for hard faults. Every state also carries a word.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        flash: {
          50: "#f7f7f8",
          100: "#eeeef0",
          200: "#d9dadd",
          300: "#b8babf",
          400: "#8f9198",
          500: "#6d7078",
          600: "#565961",
          700: "#44474e",
          800: "#2e3035",
          900: "#1c1d21",
        },
        glow: {
          50: "#fff6ed",
          100: "#ffe9d1",
          200: "#fdcf9f",
          400: "#f59042",
          500: "#e8701a",
          600: "#c45510",
          700: "#9c4011",
        },
        fault: { 50: "#fdf2f2", 100: "#fbe0e0", 600: "#c0262d", 700: "#9f1c22" },
        sound: { 50: "#f0f7f2", 600: "#2f7a4a", 700: "#23603a" },
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
    },
  },
};

export default config;
