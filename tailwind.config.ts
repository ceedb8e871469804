import type { Config } from "tailwindcss";

// Loaded from app/globals.css with `@config` (Tailwind v4 does not pick it up by itself).
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        // Undyed wool, peat and a madder red: our own palette, chosen for contrast (WCAG AA on paper).
        paper: "#FBF8F2",
        fleece: "#F1EBDF",
        peat: "#2B2622",
        bark: "#5A4F45",
        madder: "#A3342A",
        "madder-dark": "#7E241C",
        moss: "#3F5E3A",
        loch: "#2F5D7C",
        heather: "#6D5A7E",
      },
      fontFamily: {
        sans: ["var(--font-body)", "system-ui", "sans-serif"],
        display: ["var(--font-display)", "Georgia", "serif"],
      },
    },
  },
};

export default config;
