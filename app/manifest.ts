import type { MetadataRoute } from "next";

/** The web app manifest (W3C Web Application Manifest): the workshop view installs as an app on a phone. */
export default function manifest(): MetadataRoute.Manifest {
  return {
    name: "Jigboard",
    short_name: "Jigboard",
    description: "Plan, film and publish workshop builds as episodes.",
    start_url: "/",
    display: "standalone",
    background_color: "#fbf8f1",
    theme_color: "#2a1c12",
    icons: [{ src: "/icon.svg", sizes: "any", type: "image/svg+xml", purpose: "any" }],
  };
}
