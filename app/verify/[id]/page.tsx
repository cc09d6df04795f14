import { pageUuid } from "@/lib/domain/uuid";
import type { Metadata } from "next";
import Link from "next/link";
import { VerificationResultView } from "@/components/report/verification-result";
import { verifyReport } from "@/db/queries/verification";

export const metadata: Metadata = { title: "Report verification" };

type Props = { params: Promise<{ id: string }> };

/** The page the report's QR code opens: what the service signed for this id. */
export default async function VerifyIdPage({ params }: Props) {
  const id = pageUuid((await params).id);
  const result = await verifyReport(id);
  return (
    <>
      <div>
        <h1 className="text-2xl font-semibold">Report verification</h1>
        <p className="text-graphite-600">
          This is what the service holds for report id <span className="num break-all">{id}</span>. It vouches
          for no file by itself: to check a copy you hold,{" "}
          <Link href="/verify" className="text-accent-700 underline">
            upload the PDF
          </Link>
          ; its bytes must match the SHA-256 of the PDF file below.
        </p>
      </div>
      <VerificationResultView result={result} />
    </>
  );
}
