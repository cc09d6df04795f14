import type { VerificationResult } from "@/lib/domain/reports";

/** What a verification found, in plain words, with icon and word as well as colour. */
export function VerificationResultView({ result }: { result: VerificationResult }) {
  // Green only for a checked file; the record held for an id is stated, neutrally, never "authentic".
  const tone = result.authentic
    ? "pass"
    : result.checked === "record" && result.recordIntact
      ? "held"
      : "fail";
  const box = {
    pass: "border-pass-600 bg-pass-50",
    held: "border-graphite-300 bg-white",
    fail: "border-fail-600 bg-fail-50",
  }[tone];
  const text = { pass: "text-pass-700", held: "text-graphite-900", fail: "text-fail-700" }[tone];
  const headline = {
    pass: "Authentic: this file is the report as issued and signed.",
    held: "Record held by the service. No file has been checked.",
    fail: "Not verified.",
  }[tone];
  return (
    <div className="space-y-4" data-testid="verification-result">
      <div className={`flex items-start gap-3 rounded-card border-2 p-4 ${box}`}>
        <span aria-hidden="true" className={`text-2xl font-bold ${text}`}>
          {tone === "pass" ? "✓" : tone === "held" ? "ⓘ" : "✗"}
        </span>
        <div className="space-y-1">
          <p className={`text-lg font-semibold ${text}`}>{headline}</p>
          <p className="text-graphite-800">{result.statement}</p>
          {result.reason ? <p className="text-graphite-800">{result.reason}</p> : null}
          {result.fileSha256 ? (
            <p className="text-sm text-graphite-700">
              SHA-256 of the checked file: <span className="num break-all">{result.fileSha256}</span>
            </p>
          ) : null}
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
          <dt className="text-graphite-600">SHA-256 of the PDF file</dt>
          <dd className="num break-all">{result.report.pdfSha256}</dd>
          <dt className="text-graphite-600">Content SHA-256</dt>
          <dd>
            <span className="num break-all">{result.report.contentSha256}</span>
            <p className="text-xs text-graphite-600">
              Printed inside the PDF: it covers the report&apos;s content (a file cannot contain its own
              hash). A copy is checked against the SHA-256 of the PDF file above.
            </p>
          </dd>
          <dt className="text-graphite-600">Customer&apos;s answer</dt>
          <dd>
            {
              {
                awaiting: "Awaiting the customer's answer",
                accepted: "Accepted by the customer",
                rejected: "Rejected by the customer",
              }[result.report.acceptance]
            }
          </dd>
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
                <td className="px-4 py-2 font-medium">{s.meaning}</td>
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
