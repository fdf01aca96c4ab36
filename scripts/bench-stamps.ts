// Benchmark of GET /api/v1/stamps on a library of 10,000 stamps: a throwaway copy of the whole app
// (test slot 7: its own PostgreSQL cluster in .test-data-7, ports 54409/3170, build in .next-test-7)
// answers filtered, sorted pages over HTTP with an API token, as a script or the table would ask.
// Each query runs 3 times to warm up, then 30 times; the median and 95th percentile are printed
// beside the 200 ms goal. Run: npm run bench -- stamps
// Aliased: the helper only sets environment variables; it is not a React hook.
import { startTestApp, testEnvironment as testEnvironment } from "./lib/test-stack";

const STAMPS = 10_000;
const TARGET_MS = 200;
const WARM_UP = 3;
const RUNS = 30;

const queries: [string, string][] = [
  ["first page, default order", "page=1"],
  ["filtered + sorted (condition, site, width range, by width desc), page 3", "condition=sound,worn&site=Griya%20Kidul&minWidthMm=180&maxWidthMm=300&sort=-width&page=3&pageSize=50"],
  ["search 'kawung', by name, page 2", "q=kawung&sort=name&page=2"],
  ["on the shelf, pairs, by location, 100 rows", "out=false&face=pair&sort=location&pageSize=100"],
  ["search two words + tag, by maker", "q=parang%20large&tag=main&sort=maker"],
  ["deep page: by last change, page 150", "sort=-updated&page=150&pageSize=50"],
];

const quantile = (values: number[], q: number) => [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(q * values.length))];

const { env, dataDir } = testEnvironment(7);
const app = await startTestApp(dataDir);
try {
  const { database } = await import("@/db");
  const { apiTokens, users } = await import("@/db/schema");
  const { hashSecret, newSecret } = await import("@/lib/auth/secrets");
  const { seedStamps } = await import("@/scripts/seed/stamps");
  const { client, db } = database();
  const seededAt = performance.now();
  await seedStamps(db, { count: STAMPS });
  const seedMs = performance.now() - seededAt;
  await client.unsafe("ANALYZE");
  const [user] = await db.insert(users).values({ email: "bench-stamps@capgrid.test", name: "Bench", role: "planner" }).returning();
  const token = newSecret("cg_");
  await db.insert(apiTokens).values({ userId: user.id, name: "bench", tokenHash: hashSecret(token), prefix: token.slice(0, 7) });
  await client.end();

  const call = async (query: string) => {
    const started = performance.now();
    const response = await fetch(`${env.APP_URL}/api/v1/stamps?${query}`, { headers: { authorization: `Bearer ${token}`, accept: "application/json" } });
    const body = (await response.json()) as { total?: number; stamps?: unknown[] };
    const ms = performance.now() - started;
    if (!response.ok) throw new Error(`GET /api/v1/stamps?${query} answered ${response.status}: ${JSON.stringify(body)}`);
    return { ms, total: body.total ?? 0, rows: body.stamps?.length ?? 0 };
  };

  console.log(`\nGET /api/v1/stamps with ${STAMPS.toLocaleString("en")} stamps (seeded in ${(seedMs / 1000).toFixed(1)} s), ${RUNS} runs each over HTTP`);
  console.log(`${"query".padEnd(72)} ${"rows/total".padStart(12)} ${"median".padStart(9)} ${"p95".padStart(9)} ${"p95 / goal".padStart(11)}`);
  let worst = 0;
  for (const [label, query] of queries) {
    for (let i = 0; i < WARM_UP; i++) await call(query);
    const times: number[] = [];
    let last = { total: 0, rows: 0 };
    for (let i = 0; i < RUNS; i++) {
      const r = await call(query);
      times.push(r.ms);
      last = r;
    }
    const p95 = quantile(times, 0.95);
    worst = Math.max(worst, p95);
    console.log(
      `${label.padEnd(72)} ${`${last.rows}/${last.total}`.padStart(12)} ${`${quantile(times, 0.5).toFixed(1)} ms`.padStart(9)} ${`${p95.toFixed(1)} ms`.padStart(9)} ${(p95 / TARGET_MS).toFixed(2).padStart(11)}`,
    );
  }
  console.log(`\nslowest p95 ${worst.toFixed(1)} ms against the ${TARGET_MS} ms goal: ${worst < TARGET_MS ? "met" : "NOT met"}`);
  process.exitCode = worst < TARGET_MS ? 0 : 1;
} finally {
  app.stop();
}
