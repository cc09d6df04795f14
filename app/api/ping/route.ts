// A bare route handler that returns static JSON, public by design: the ceiling the load
// benchmark compares the real routes against (no session, no database).
export function GET() {
  return Response.json({ ok: true });
}
