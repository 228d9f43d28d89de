import type { Config } from "tailwindcss";
import { STAGE_COLOURS } from "./lib/stages";

/**
 * Jigboard's tokens, written down once. Pale timber surfaces, dark walnut
 * text, one chalk-line blue accent for the primary action. Hazard colours
 * follow the ANSI Z535 / ISO 3864 signal words and are used for nothing else.
 */
export default {
  theme: {
    extend: {
      colors: {
        timber: { 50: "#fbf8f1", 100: "#f4ecdc", 200: "#e8d9bd", 300: "#d5bd93", 400: "#b89a6a" },
        walnut: { 900: "#2a1c12", 800: "#3b2a1e", 700: "#54402f", 600: "#6b5442", 500: "#846b57" },
        chalk: { 700: "#184b6e", 600: "#1f5f8b", 500: "#2a74a8", 100: "#dde9f2" },
        stage: STAGE_COLOURS,
        hazard: { caution: "#ffd100", warning: "#ff7900", danger: "#c8102e" },
        // Refusals and errors (not safety: hazard colours are only for cautions).
        fault: { 50: "#fdf3f4", 100: "#fbeaec", 700: "#9b0d23", 900: "#5c0815" },
        // Done, saved, passing.
        pass: { 50: "#f1f8f2", 100: "#e7f3e8", 600: "#2f6b3a", 700: "#1d4a26", 900: "#173d1d" },
        // Needs a look (a merge to make).
        heed: { 50: "#fff7e8", 600: "#9b5b00", 800: "#6b3f00" },
        broll: "#2f7a78",
      },
      fontFamily: {
        sans: ['"Space Grotesk"', "system-ui", "sans-serif"],
        mono: ['"JetBrains Mono"', "ui-monospace", "monospace"],
      },
      borderRadius: { plank: "3px" },
    },
  },
} satisfies Config;
