/**
 * Display helpers shared by pages, exports and the report: one date-time format everywhere —
 * "2026-12-04 06:12 GMT+1", 24-hour, with the zone always shown — in the reader's zone on screen
 * and in UTC in exports and the PDF.
 */
import { wallClock } from "@/lib/domain/schedule";

const toDate = (d: Date | string) => (typeof d === "string" ? new Date(d) : d);

/** Date and time in UTC with the zone spelled out, so a printed value is never ambiguous. */
export function formatDateTimeUtc(d: Date | string | null | undefined): string {
  if (!d) return "—";
  return `${toDate(d).toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/**
 * Date and time in the given IANA zone (the reader's), in the same shape as formatDateTimeUtc
 * with the offset named: "2026-12-04 07:12 GMT+1". Falls back to UTC for an unknown zone.
 */
export function formatDateTime(d: Date | string | null | undefined, timeZone: string): string {
  if (!d) return "—";
  const date = toDate(d);
  if (timeZone === "UTC" || timeZone === "Etc/UTC") return formatDateTimeUtc(date);
  let p: ReturnType<typeof wallClock>;
  try {
    p = wallClock(date, timeZone, { timeZoneName: "shortOffset" });
  } catch {
    return formatDateTimeUtc(date);
  }
  return `${p("year")}-${p("month")}-${p("day")} ${p("hour")}:${p("minute")} ${p("timeZoneName")}`;
}

export function formatDate(d: Date | string | null | undefined): string {
  if (!d) return "—";
  return toDate(d).toISOString().slice(0, 10);
}

/** The text closed with a full stop, unless it already ends with one (or with ? or !): notes people type often do. */
export function endSentence(text: string): string {
  const t = text.trimEnd();
  return /[.!?]$/.test(t) ? t : `${t}.`;
}
