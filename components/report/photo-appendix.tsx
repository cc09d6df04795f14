/**
 * The report page's appendix of photos, as the PDF lists them: step, phase, time (UTC), who took
 * each, its size and SHA-256, so a stored image can be matched to the signed report.
 */
import { PHOTO_APPENDIX_TITLE, photoLine, type PhotoAppendixRow } from "@/lib/report/sections/photo-rows";

export function PhotoAppendixSection({ rows }: { rows: readonly PhotoAppendixRow[] | undefined }) {
  if (!rows?.length) return null;
  return (
    <section className="space-y-2">
      <h3 className="border-b border-graphite-200 pb-1 text-base font-semibold">{PHOTO_APPENDIX_TITLE}</h3>
      <ul className="space-y-1.5 text-sm">
        {rows.map((r) => (
          <li key={r.sha256 + r.takenAtUtc}>
            {photoLine(r)}
            <span className="num block break-all text-xs text-graphite-500">SHA-256 {r.sha256}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
