/** Where a saved 3D view's stored picture is served (behind the session). */
export const storedViewUrl = (viewId: string) => `/api/analysis-views/${viewId}/image`;

/**
 * The stored picture of a saved 3D view, part of a signed record: served as is, never through the
 * image optimizer, so what the page shows is the file whose SHA-256 was signed.
 */
export function StoredViewImage({
  viewId,
  alt,
  ...img
}: { viewId: string; alt: string } & Omit<React.ImgHTMLAttributes<HTMLImageElement>, "src" | "alt">) {
  // eslint-disable-next-line @next/next/no-img-element
  return <img src={storedViewUrl(viewId)} alt={alt} {...img} />;
}
