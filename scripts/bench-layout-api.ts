// Benchmark of POST /api/v1/layout end to end: a throwaway copy of the app (test slot 8) answers a
// 100 m plan over HTTP; printed beside the engine's own time for the same plan in this process.
// Run: npm run bench -- layout-api
import { computeLayout, type LayoutInput } from "@/lib/layout";
import { lobedMotif } from "./lib/motifs";
import { startTestApp, testEnvironment } from "./lib/test-stack";

const TARGET_MS = 300;
const RUNS = 21;
const plan = (vertices: number): LayoutInput => ({
  cloth: { widthMm: 1150, lengthMm: 100_000 },
  stamp: { widthMm: 210, heightMm: 210, outline: lobedMotif(vertices, 210) },
  gap: { xMm: -15, yMm: -15 },
  arrangement: "half-drop",
});

const quantile = (values: number[], q: number) => [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(q * values.length))];

const { env, dataDir } = testEnvironment(8);
const app = await startTestApp(dataDir);
try {
  const { database } = await import("@/db");
  const { apiTokens, users } = await import("@/db/schema");
  const { hashSecret, newSecret } = await import("@/lib/auth/secrets");
  const { client, db } = database();
  const [user] = await db.insert(users).values({ email: "bench@capgrid.test", name: "Bench", role: "planner" }).returning();
  const token = newSecret("cg_");
  await db.insert(apiTokens).values({ userId: user.id, name: "bench", tokenHash: hashSecret(token), prefix: token.slice(0, 7) });
  await client.end();

  console.log(`POST ${env.APP_URL}/api/v1/layout — 100 m of 1150 mm cloth, half-drop, −15 mm gaps (overlapping)`);
  console.log("vertices  engine ms (median)  HTTP ms (median)  HTTP ms (p95)  HTTP/engine  target");
  for (const vertices of [200, 2000]) {
    const body = JSON.stringify(plan(vertices));
    const engine: number[] = [];
    const http: number[] = [];
    for (let k = 0; k < RUNS; k++) {
      let t0 = performance.now();
      computeLayout(plan(vertices));
      engine.push(performance.now() - t0);
      t0 = performance.now();
      const response = await fetch(`${env.APP_URL}/api/v1/layout`, {
        method: "POST",
        headers: { "content-type": "application/json", authorization: `Bearer ${token}` },
        body,
      });
      await response.json();
      if (!response.ok) throw new Error(`the API answered ${response.status}`);
      http.push(performance.now() - t0);
    }
    // The first request warms the server's code paths; it is left out.
    http.shift();
    engine.shift();
    const e = quantile(engine, 0.5);
    const h = quantile(http, 0.5);
    const p95 = quantile(http, 0.95);
    const verdict = p95 < TARGET_MS ? `< ${TARGET_MS} ms: met` : `< ${TARGET_MS} ms: MISSED`;
    console.log(`${String(vertices).padStart(8)}  ${e.toFixed(1).padStart(18)}  ${h.toFixed(1).padStart(16)}  ${p95.toFixed(1).padStart(13)}  ${(h / e).toFixed(2).padStart(11)}  ${verdict}`);
  }
} finally {
  app.stop();
}
process.exit(0);
