import { palette } from "@/lib/domain/theme";
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
    background_color: palette.graphite[50],
    theme_color: palette.graphite[900],
    icons: [{ src: "/icon.svg", sizes: "any", type: "image/svg+xml", purpose: "any" }],
  };
}
