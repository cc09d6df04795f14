import type { VerificationResult } from "@/lib/report/types";

/** What a verification found, in plain words, with icon and word as well as colour. */
export function VerificationResultView({ result }: { result: VerificationResult }) {
  const ok = result.authentic;
  return (
    <div className="space-y-4" data-testid="verification-result">
      <div
        className={`flex items-start gap-3 rounded-card border-2 p-4 ${ok ? "border-pass-600 bg-pass-50" : "border-fail-600 bg-fail-50"}`}
      >
        <span aria-hidden="true" className={`text-2xl font-bold ${ok ? "text-pass-700" : "text-fail-700"}`}>
          {ok ? "✓" : "✗"}
        </span>
        <div>
          <p className={`text-lg font-semibold ${ok ? "text-pass-700" : "text-fail-700"}`}>
            {ok ? "Authentic: this is the report as issued and signed." : "Not verified."}
          </p>
          {result.reason ? <p className="text-graphite-800">{result.reason}</p> : null}
        </div>
      </div>
      {result.report ? (
        <dl className="grid grid-cols-[minmax(9rem,auto)_1fr] gap-x-6 gap-y-2 rounded-card border border-graphite-200 bg-white p-5 text-sm">
          <dt className="text-graphite-600">Report</dt>
          <dd className="num">
            {result.report.reference}, revision {result.report.revision}
          </dd>
          <dt className="text-graphite-600">Issued</dt>
          <dd className="num">{result.report.issuedAtUtc}</dd>
          <dt className="text-graphite-600">SHA-256 of the PDF</dt>
          <dd className="num break-all">{result.report.pdfSha256}</dd>
          <dt className="text-graphite-600">Newer revision</dt>
          <dd>
            {result.report.supersededBy ? (
              <a className="text-accent-700 underline" href={`/verify/${result.report.supersededBy.id}`}>
                Superseded by revision {result.report.supersededBy.revision}
              </a>
            ) : (
              "None: this is the current revision."
            )}
          </dd>
          {result.report.amendmentOf ? (
            <>
              <dt className="text-graphite-600">Amends</dt>
              <dd>
                <a className="text-accent-700 underline" href={`/verify/${result.report.amendmentOf.id}`}>
                  Revision {result.report.amendmentOf.revision}
                </a>
              </dd>
            </>
          ) : null}
        </dl>
      ) : null}
      {result.signatures?.length ? (
        <table className="w-full overflow-hidden rounded-card border border-graphite-200 bg-white text-sm">
          <caption className="sr-only">Signatures</caption>
          <thead className="bg-graphite-50 text-left text-graphite-600">
            <tr>
              <th scope="col" className="px-4 py-2 font-medium">
                Meaning
              </th>
              <th scope="col" className="px-4 py-2 font-medium">
                Signed by
              </th>
              <th scope="col" className="px-4 py-2 font-medium">
                When
              </th>
              <th scope="col" className="px-4 py-2 font-medium">
                Signature
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {result.signatures.map((s, i) => (
              <tr key={i}>
                <td className="px-4 py-2 font-medium">
                  {s.meaning}
                  {s.comment ? <p className="font-normal text-graphite-600">“{s.comment}”</p> : null}
                </td>
                <td className="px-4 py-2">
                  {s.name} — {s.role}
                </td>
                <td className="num px-4 py-2">{s.signedAtUtc}</td>
                <td className={`px-4 py-2 font-medium ${s.valid ? "text-pass-700" : "text-fail-700"}`}>
                  {s.valid ? "✓ Valid" : "✗ Does not verify"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {result.keyId ? (
        <p className="text-xs text-graphite-500">
          Checked with the service&apos;s Ed25519 key {result.keyId} (published at /api/report-key).
        </p>
      ) : null}
    </div>
  );
}
