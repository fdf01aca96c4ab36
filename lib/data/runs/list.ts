import "server-only";
import { and, asc, count, desc, eq, ilike, inArray, or } from "drizzle-orm";
import { db } from "@/db";
import { runs } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { RunDto, RunListDto } from "@/lib/contracts/runs";
import type { RunListQuery } from "@/lib/validation/runs";
import { runDto, runSummaries } from "./shared";

const sortColumns = { due: runs.dueOn, name: runs.name, updated: runs.updatedAt } as const;

/** Runs by words (name, cloth), state and motif, sorted and paged. */
export async function listRuns(actor: Actor, query: RunListQuery): Promise<RunListDto> {
  assertCan(actor, "data:read");
  const words = query.q ? `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` : null;
  const where = and(
    words ? or(ilike(runs.name, words), ilike(runs.cloth, words)) : undefined,
    query.state?.length ? inArray(runs.state, query.state) : undefined,
    query.motif ? eq(runs.motifId, query.motif) : undefined,
  );
  const descending = query.sort.startsWith("-");
  const column = sortColumns[query.sort.replace(/^-/, "") as keyof typeof sortColumns];
  const [rows, [{ n }]] = await Promise.all([
    db
      .select()
      .from(runs)
      .where(where)
      .orderBy(descending ? desc(column) : asc(column), asc(runs.id))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(runs).where(where),
  ]);
  return { runs: await runSummaries(db, rows), total: n, page: query.page, pageSize: query.pageSize };
}

export async function getRun(actor: Actor, id: string): Promise<RunDto> {
  assertCan(actor, "data:read");
  return runDto(db, id);
}
