/**
 * Photos of a step, made safe to keep: the type is read from the image's own bytes (sharp's
 * metadata, never the name or the browser's content type), and the stored image is a fresh JPEG
 * encoded by the server — turned upright by its orientation tag, with its metadata (GPS position,
 * device serials) left behind — plus a small thumbnail.
 */
import "server-only";
import { createHash } from "node:crypto";
import sharp, { type Metadata } from "sharp";
import { invalid, AppError } from "@/lib/errors";

/** Largest photo accepted (bytes of the whole upload): a modern tablet's full-size JPEG fits. */
export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;
/** Pixels decoded at most (a decompression bomb is refused before it fills the memory). */
const MAX_PIXELS = 60_000_000;
/** The stored image's longest side, and the thumbnail's. */
const FULL_SIDE = 2400;
const THUMB_SIDE = 320;

/** Image formats taken from the tablet, by what sharp finds in the bytes. */
export const PHOTO_FORMATS = ["jpeg", "png", "webp", "heif", "avif", "tiff"] as const;

export interface ProcessedPhoto {
  readonly image: Buffer;
  readonly thumb: Buffer;
  readonly width: number;
  readonly height: number;
  /** SHA-256 of the stored image, lower-case hex. */
  readonly sha256: string;
}

const notAPhoto = (why: string) =>
  new AppError(415, "unsupported_media_type", `That file is not a photo Trammel can keep: ${why}`, [
    { field: "file", message: why },
  ]);

/** Checks the bytes are a photo (415 otherwise) and makes the stored image and its thumbnail. */
export async function processPhoto(data: Buffer): Promise<ProcessedPhoto> {
  if (data.length === 0) throw invalid("The photo is empty.", [{ field: "file", message: "no bytes" }]);
  let meta: Metadata;
  try {
    meta = await sharp(data, { limitInputPixels: MAX_PIXELS }).metadata();
  } catch {
    throw notAPhoto("its content is not an image format (JPEG, PNG, WebP, HEIF).");
  }
  if (!meta.format || !(PHOTO_FORMATS as readonly string[]).includes(meta.format))
    throw notAPhoto(
      `${meta.format ?? "unknown"} images are not taken; send a JPEG, PNG, WebP or HEIF photo.`,
    );
  if (!meta.width || !meta.height) throw notAPhoto("the image has no size.");
  try {
    const base = () => sharp(data, { limitInputPixels: MAX_PIXELS }).rotate();
    const full = await base()
      .resize({ width: FULL_SIDE, height: FULL_SIDE, fit: "inside", withoutEnlargement: true })
      .jpeg({ quality: 85 })
      .toBuffer({ resolveWithObject: true });
    const thumb = await base()
      .resize({ width: THUMB_SIDE, height: THUMB_SIDE, fit: "inside", withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer();
    return {
      image: full.data,
      thumb,
      width: full.info.width,
      height: full.info.height,
      sha256: createHash("sha256").update(full.data).digest("hex"),
    };
  } catch {
    throw notAPhoto("the image could not be decoded (it may be cut short or damaged).");
  }
}
