/**
 * What the public verification says. For a report id (the QR code's page) it states what the
 * service holds — issued, revision, superseded by, signatures, acceptance — and that the stored
 * record is intact, but vouches for no file: only a file that was checked (its bytes hashed and
 * found to be those of an issued revision) is `authentic`, shown with that file's SHA-256. It
 * carries no comments: a customer's reasons stay with the job.
 */
export interface VerificationResult {
  /** What was checked: the record held for an id, or a file someone holds. */
  checked: "record" | "file";
  /** True only for a checked file whose bytes are an issued revision with every signature valid. */
  authentic: boolean;
  /** The stored PDF still hashes to its recorded SHA-256 and every signature verifies. */
  recordIntact: boolean;
  /** SHA-256 of the checked file (checked = "file"). */
  fileSha256?: string;
  /** Plain words: what this answer vouches for and what it does not. */
  statement: string;
  reason?: string;
  report?: {
    id: string;
    reference: string;
    revision: number;
    issuedAtUtc: string;
    /** SHA-256 of the PDF file as issued: a copy is authentic when its bytes hash to this. */
    pdfSha256: string;
    /** SHA-256 of the report's content (canonical JSON), printed inside the PDF. */
    contentSha256: string;
    supersededBy: { id: string; revision: number } | null;
    amendmentOf: { id: string; revision: number } | null;
    /** The customer's answer to this revision. */
    acceptance: "awaiting" | "accepted" | "rejected";
  };
  signatures?: Array<{
    meaning: string;
    name: string;
    role: string;
    signedAtUtc: string;
    valid: boolean;
  }>;
  keyId?: string;
}
