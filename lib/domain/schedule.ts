/**
 * A job's schedule is given as a wall-clock date and time in a named IANA zone (where the machine
 * stands) and stored as one UTC instant plus that zone's name. Pure, so it is unit-tested
 * (tests/unit/jobs-office.test.ts) against offsets published in the IANA time zone database.
 */

/** True when the runtime knows this IANA zone name (e.g. "Europe/Berlin"). */
export function isTimeZone(zone: string): boolean {
  if (!zone || zone.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/**
 * The wall-clock fields of an instant in `zone` (24-hour, zero-padded), looked up by part type;
 * `more` asks for further parts (seconds, the zone's name). Throws RangeError for an unknown zone.
 */
export function wallClock(at: Date, zone: string, more: Intl.DateTimeFormatOptions = {}) {
  const parts = new Intl.DateTimeFormat("en-GB", {
    timeZone: zone,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
    ...more,
  }).formatToParts(at);
  return (t: Intl.DateTimeFormatPartTypes) => parts.find((x) => x.type === t)?.value ?? "";
}

/** The zone's offset from UTC at this instant, in minutes (east positive). */
function offsetMinutes(instantMs: number, zone: string): number {
  const p = wallClock(new Date(instantMs), zone, { second: "2-digit" });
  const n = (t: Intl.DateTimeFormatPartTypes) => Number(p(t));
  const wall = Date.UTC(n("year"), n("month") - 1, n("day"), n("hour"), n("minute"), n("second"));
  return Math.round((wall - Math.floor(instantMs / 1000) * 1000) / 60_000);
}

const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const TIME = /^([01]\d|2[0-3]):([0-5]\d)$/;

/**
 * The UTC instant of a wall-clock date ("2027-03-15") and time ("08:30") in `zone`, or null when
 * the input is malformed or the time does not exist there (skipped when clocks go forward). A
 * time that occurs twice (clocks go back) resolves to the first occurrence.
 */
export function zonedToUtc(date: string, time: string, zone: string): Date | null {
  const d = DATE.exec(date);
  const t = TIME.exec(time);
  if (!d || !t || !isTimeZone(zone)) return null;
  const [y, mo, da, h, mi] = [d[1], d[2], d[3], t[1], t[2]].map(Number) as [
    number,
    number,
    number,
    number,
    number,
  ];
  const wall = Date.UTC(y, mo - 1, da, h, mi);
  const check = new Date(wall);
  if (check.getUTCMonth() !== mo - 1 || check.getUTCDate() !== da) return null;
  // Try the offsets in force a day either side; keep the earliest candidate that reads back.
  const candidates = [
    ...new Set([offsetMinutes(wall - 86_400_000, zone), offsetMinutes(wall + 86_400_000, zone)]),
  ]
    .map((off) => wall - off * 60_000)
    .filter((ms) => offsetMinutes(ms, zone) === (wall - ms) / 60_000)
    .sort((a, b) => a - b);
  return candidates.length ? new Date(candidates[0]!) : null;
}

/** The wall-clock date and time of an instant in `zone` (to fill the schedule fields back in). */
export function utcToZoned(at: Date, zone: string): { date: string; time: string } {
  const p = wallClock(at, isTimeZone(zone) ? zone : "UTC");
  return { date: `${p("year")}-${p("month")}-${p("day")}`, time: `${p("hour")}:${p("minute")}` };
}
