/**
 * The jobs board's URL ↔ API query, shared by the server page (its first render) and the board in
 * the browser (the SWR key), so both name the same request and the first answer is reused.
 */

/** Rows per page on the board. */
export const BOARD_PAGE_SIZE = 25;
/** The URL's parameters the board keeps (and sends to GET /api/jobs). */
export const BOARD_PARAMS = ["status", "q", "sort", "dir", "queue", "page"] as const;

/** The API's query for these URL parameters: the kept ones, in a fixed order, plus the page size. */
export function boardQuery(params: URLSearchParams): string {
  const q = new URLSearchParams();
  for (const k of BOARD_PARAMS) {
    const v = params.get(k);
    if (v) q.set(k, v);
  }
  q.set("pageSize", String(BOARD_PAGE_SIZE));
  return q.toString();
}
