import type { Metadata } from "next";
import { VerifyUpload } from "./verify-upload";

export const metadata: Metadata = { title: "Verify a report" };

export default function VerifyPage() {
  return (
    <>
      <div>
        <h1 className="text-2xl font-semibold">Verify an acceptance report</h1>
        <p className="text-graphite-600">
          Drop the PDF you were given. Its SHA-256 is compared with the signed record of every report issued
          through this service: one changed byte and it will not verify. Nothing is stored.
        </p>
      </div>
      <VerifyUpload />
    </>
  );
}
