import { getSigningKey } from "@/lib/report/keys";

export const runtime = "nodejs";

/** Public: the Ed25519 key that signs reports, so anyone can check a signature independently. */
export async function GET() {
  const key = getSigningKey();
  return Response.json({
    algorithm: "Ed25519",
    keyId: key.keyId,
    publicKeyPem: key.publicKeyPem,
    signs: "canonical JSON (sorted keys) of each signature manifest",
  });
}
