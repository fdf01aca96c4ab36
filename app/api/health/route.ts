// GET /api/health — for a load balancer: 200 when this server reaches the database and the object store, else 503 (no sign-in)
import { health } from "@/lib/data/health";

export const dynamic = "force-dynamic";

export async function GET() {
  const answer = await health();
  return Response.json(answer, { status: answer.ok ? 200 : 503, headers: { "cache-control": "no-store" } });
}
