import type { MetadataRoute } from "next";

/** Lets the tablet add Trammel to its home screen and open it full screen, like an app. */
export default function manifest(): MetadataRoute.Manifest {
  return {
    name: "Trammel",
    short_name: "Trammel",
    description: "Readings, fits and signed acceptance records for two-axis milling heads.",
    start_url: "/jobs",
    scope: "/",
    display: "standalone",
    orientation: "any",
    background_color: "#f6f7f8",
    theme_color: "#1d2125",
    icons: [{ src: "/icon.svg", sizes: "any", type: "image/svg+xml", purpose: "any" }],
  };
}
