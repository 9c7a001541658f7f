import type { Config } from "tailwindcss";

export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Work Sans"', "ui-sans-serif", "system-ui", "sans-serif"],
      },
      colors: {
        // Ink-blue and paper-white base with one warm accent (our own palette).
        ink: {
          50: "#eef2f8",
          100: "#d9e1ee",
          200: "#b3c2dc",
          300: "#8097bf",
          500: "#3d5a8c",
          700: "#213a66",
          800: "#182c50",
          900: "#0f1d38",
        },
        paper: "#fbfaf6",
        accent: { 400: "#f0a35e", 500: "#e0823a", 700: "#9c4f14" },
      },
    },
  },
} satisfies Config;
