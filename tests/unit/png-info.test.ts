// The PNG header reader (lib/png-info.ts) against PNGs written by pngjs (an independent encoder)
// and CRC-32 against Node's zlib.crc32 (zlib's implementation of the same polynomial).
import { crc32 as zlibCrc32 } from "node:zlib";
import { PNG } from "pngjs";
import { describe, expect, it } from "vitest";
import { crc32, PngError, readPngInfo } from "@/lib/png-info";

function pngOf(
  width: number,
  height: number,
  opts: { colorType?: 0 | 2 | 4 | 6; bitDepth?: 8 | 16 } = {},
): Buffer {
  const img = new PNG({ width, height });
  for (let i = 0; i < img.data.length; i++) img.data[i] = (i * 37) & 0xff;
  return PNG.sync.write(img, { colorType: opts.colorType ?? 6, bitDepth: opts.bitDepth ?? 8 });
}

describe("readPngInfo", () => {
  it("reads width and height as pngjs wrote them, for several sizes and colour types", () => {
    for (const [w, h, ct] of [
      [1, 1, 6],
      [1440, 480, 6],
      [317, 2049, 2],
      [64, 3, 0],
    ] as const) {
      const bytes = pngOf(w, h, { colorType: ct });
      const info = readPngInfo(bytes);
      expect(info).toEqual({ widthPx: w, heightPx: h, bitDepth: 8, colourType: ct });
      // pngjs reads back the same size (its own decoder).
      const back = PNG.sync.read(bytes);
      expect([back.width, back.height]).toEqual([info.widthPx, info.heightPx]);
    }
  });

  it("refuses a file that is not a PNG, naming the reason", () => {
    expect(() => readPngInfo(Buffer.from("GIF89a............................"))).toThrow(/not a PNG/);
    expect(() => readPngInfo(Buffer.from([0xff, 0xd8, 0xff, 0xe0]))).toThrow(PngError);
    expect(() => readPngInfo(new Uint8Array(0))).toThrow(/not a PNG/);
  });

  it("refuses a PNG cut off inside its header, and one whose header bytes were altered (CRC)", () => {
    const bytes = pngOf(20, 10);
    expect(() => readPngInfo(bytes.subarray(0, 20))).toThrow(/cut off/);
    const altered = Buffer.from(bytes);
    altered[19] = altered[19]! ^ 0x01; // width changed, CRC not
    expect(() => readPngInfo(altered)).toThrow(/CRC/);
  });

  it("crc32 equals zlib's CRC-32 on the IHDR chunk and on arbitrary bytes", () => {
    const bytes = pngOf(9, 7);
    expect(crc32(bytes.subarray(12, 29))).toBe(bytes.readUInt32BE(29));
    for (const s of ["", "a", "123456789", "Trammel saved view"])
      expect(crc32(Buffer.from(s))).toBe(zlibCrc32(Buffer.from(s)));
    // The check value of CRC-32/ISO-HDLC for "123456789" (from the CRC catalogue, from memory): 0xCBF43926.
    expect(crc32(Buffer.from("123456789"))).toBe(0xcbf43926);
  });
});
