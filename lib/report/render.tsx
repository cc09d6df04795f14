/** Renders report data to PDF bytes, once; the bytes are what gets stored and signed. */
import { createHash } from "node:crypto";
import { renderToBuffer } from "@react-pdf/renderer";
import QRCode from "qrcode";
import { ReportDocument } from "./document";
import { registerReportFonts } from "./fonts";
import type { ReportData } from "./types";

/**
 * `images` are the figures' PNG bytes by SHA-256; a byte string whose hash is not the one the
 * data names is refused, so the signed content hash always covers the picture printed.
 */
export async function renderReportPdf(
  data: ReportData,
  fontsDir?: string,
  images: ReadonlyMap<string, Buffer> = new Map(),
): Promise<Buffer> {
  for (const [sha, png] of images) {
    if (createHash("sha256").update(png).digest("hex") !== sha)
      throw new Error(`renderReportPdf: the picture named ${sha.slice(0, 12)}… has other bytes`);
  }
  registerReportFonts(fontsDir);
  const qrDataUrl = await QRCode.toDataURL(data.verifyUrl, {
    margin: 1,
    width: 256,
    errorCorrectionLevel: "M",
  });
  return renderToBuffer(<ReportDocument data={data} qrDataUrl={qrDataUrl} images={images} />);
}
