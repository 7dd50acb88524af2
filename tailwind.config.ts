/** Design tokens: drafting-office paper, graphite ink, one deep teal accent, severity colours. */
import type { Config } from "tailwindcss";

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f1e7", deep: "#ece4d3", line: "#d8ccb4" },
        graphite: { DEFAULT: "#2b2d2f", soft: "#55595d", faint: "#8a8d90" },
        teal: { DEFAULT: "#0f5b5c", dark: "#0a4243", light: "#d6e8e6" },
        severity: {
          error: "#a3271f",
          "error-bg": "#f6dcd6",
          warning: "#8a5a00",
          "warning-bg": "#f6e7c4",
          info: "#2f5d8a",
          "info-bg": "#dbe6f1",
        },
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
    },
  },
  plugins: [],
};

export default config;
