"use client";

import { useSyncExternalStore } from "react";
import { formatDateTime } from "@/lib/format";

const noChange = () => () => {};
const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";

/**
 * A date-time in the reader's own zone with the zone shown. The server renders UTC (it does not
 * know the reader's zone); the browser then shows its zone, without a hydration mismatch.
 */
export function LocalTime({ at }: { at: string | Date }) {
  const zone = useSyncExternalStore(noChange, browserZone, () => "UTC");
  const iso = typeof at === "string" ? at : at.toISOString();
  return (
    <time dateTime={iso} className="num whitespace-nowrap">
      {formatDateTime(iso, zone)}
    </time>
  );
}
