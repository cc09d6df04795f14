/** What public verification of an issued report answers (the /verify page and /api/verify). */
export interface VerificationResult {
  authentic: boolean;
  reason?: string;
  report?: {
    id: string;
    reference: string;
    revision: number;
    issuedAtUtc: string;
    pdfSha256: string;
    supersededBy: { id: string; revision: number } | null;
    amendmentOf: { id: string; revision: number } | null;
  };
  signatures?: Array<{
    meaning: string;
    name: string;
    role: string;
    signedAtUtc: string;
    valid: boolean;
    comment: string | null;
  }>;
  keyId?: string;
}
