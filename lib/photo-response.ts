/** The HTTP answer carrying a stored photo: always a JPEG the server made, never sniffed. */
export function photoResponse(data: Buffer, sha256: string | null): Response {
  return new Response(new Uint8Array(data), {
    headers: {
      "Content-Type": "image/jpeg",
      "Content-Length": String(data.length),
      "X-Content-Type-Options": "nosniff",
      ...(sha256 ? { "X-Checksum-SHA256": sha256 } : {}),
      "Cache-Control": "private, max-age=3600",
    },
  });
}
