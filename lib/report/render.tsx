/** Renders report data to PDF bytes, once; the bytes are what gets stored and signed. */
import { renderToBuffer } from "@react-pdf/renderer";
import QRCode from "qrcode";
import { ReportDocument } from "./document";
import { registerReportFonts } from "./fonts";
import type { ReportData } from "./types";

export async function renderReportPdf(data: ReportData, fontsDir?: string): Promise<Buffer> {
  registerReportFonts(fontsDir);
  const qrDataUrl = await QRCode.toDataURL(data.verifyUrl, { margin: 1, width: 256, errorCorrectionLevel: "M" });
  return renderToBuffer(<ReportDocument data={data} qrDataUrl={qrDataUrl} />);
}
