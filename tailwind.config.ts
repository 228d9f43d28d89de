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
      },
      fontFamily: {
        sans: ['"Space Grotesk"', "system-ui", "sans-serif"],
        mono: ['"JetBrains Mono"', "ui-monospace", "monospace"],
      },
      borderRadius: { plank: "3px" },
    },
  },
} satisfies Config;
