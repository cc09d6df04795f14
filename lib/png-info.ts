/**
 * Reads what the server needs to know of an uploaded PNG before storing it: that it is a PNG (the
 * 8-byte signature) and its size in pixels (the IHDR chunk, which the PNG specification — ISO/IEC
 * 15948, W3C PNG 2nd edition §5.2, §11.2.2 — requires to come first). The IHDR chunk's CRC-32 is
 * checked too, so a truncated or altered header is refused rather than trusted. Pure; no decoding.
 */

const SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a] as const;
/** The PNG specification's limit on width and height (2³¹ − 1); a browser canvas is far smaller. */
const MAX_DIMENSION = 0x7fffffff;

export interface PngInfo {
  readonly widthPx: number;
  readonly heightPx: number;
  readonly bitDepth: number;
  readonly colourType: number;
}

export class PngError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PngError";
  }
}

let table: Uint32Array | null = null;
/** CRC-32 as the PNG specification (Annex D) defines it: polynomial 0xEDB88320, reflected. */
export function crc32(bytes: Uint8Array): number {
  if (!table) {
    table = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      table[n] = c >>> 0;
    }
  }
  let c = 0xffffffff;
  for (let i = 0; i < bytes.length; i++) c = table[(c ^ bytes[i]!) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** The signature and IHDR of `bytes`; throws PngError saying what is wrong. */
export function readPngInfo(bytes: Uint8Array): PngInfo {
  if (bytes.length < 8 || SIGNATURE.some((b, i) => bytes[i] !== b))
    throw new PngError("The file is not a PNG image (its first bytes are not the PNG signature).");
  if (bytes.length < 33) throw new PngError("The PNG is cut off before the end of its header (IHDR).");
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const length = view.getUint32(8);
  const type = String.fromCharCode(bytes[12]!, bytes[13]!, bytes[14]!, bytes[15]!);
  if (type !== "IHDR" || length !== 13)
    throw new PngError("The PNG does not start with a 13-byte IHDR header chunk.");
  const crc = view.getUint32(29);
  if (crc32(bytes.subarray(12, 29)) !== crc)
    throw new PngError("The PNG header (IHDR) fails its CRC check; the file is damaged.");
  const widthPx = view.getUint32(16);
  const heightPx = view.getUint32(20);
  if (widthPx === 0 || heightPx === 0 || widthPx > MAX_DIMENSION || heightPx > MAX_DIMENSION)
    throw new PngError(`The PNG says it is ${widthPx} × ${heightPx} pixels, which is not a valid size.`);
  return { widthPx, heightPx, bitDepth: bytes[24]!, colourType: bytes[25]! };
}
