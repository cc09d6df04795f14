/** Display helpers shared by pages and the report: dates with their zone. */

/** Date and time in UTC with the zone spelled out, so a printed value is never ambiguous. */
export function formatDateTimeUtc(d: Date | string | null | undefined): string {
  if (!d) return "—";
  const date = typeof d === "string" ? new Date(d) : d;
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

export function formatDate(d: Date | string | null | undefined): string {
  if (!d) return "—";
  const date = typeof d === "string" ? new Date(d) : d;
  return date.toISOString().slice(0, 10);
}
