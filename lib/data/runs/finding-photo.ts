import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { runFindings } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { RunFindingDto } from "@/lib/contracts/runs";
import { AppError } from "@/lib/errors";
import { deletePictureQuietly, pictureResponse, storePicture } from "../pictures";
import { findRun, recordRunEvent, toFindingDto } from "./shared";

// A quality finding's photo: checked like a scan and stored by the picture store (lib/data/pictures.ts) under
// pictures/findings/<run>/<finding>/…, its key on the finding (runFindings.photoKey).

const owner = (runId: string, findingId: string) => `${runId}/${findingId}`;

async function findingOf(runId: string, findingId: string) {
  const [finding] = await db
    .select()
    .from(runFindings)
    .where(and(eq(runFindings.id, findingId), eq(runFindings.runId, runId)))
    .limit(1);
  if (!finding) throw new AppError("notFound");
  return finding;
}

/**
 * Checks and stores the photo of one of the run's findings (who may record findings may add its photo). The
 * picture is checked before anything changes (ScanRejected → 4xx, nothing stored); a photo already there is
 * replaced, its objects removed once the new key is saved. A `finding` history row says so.
 */
export async function attachFindingPhoto(actor: Actor, runId: string, findingId: string, bytes: Uint8Array, fileName?: string): Promise<RunFindingDto> {
  assertCan(actor, "runs:recordFindings");
  await findRun(db, runId);
  await findingOf(runId, findingId);
  const picture = await storePicture("findings", owner(runId, findingId), bytes, fileName);
  let previous: string | null = null;
  try {
    const row = await db.transaction(async (tx) => {
      const run = await findRun(tx, runId);
      const [f] = await tx
        .select()
        .from(runFindings)
        .where(and(eq(runFindings.id, findingId), eq(runFindings.runId, runId)))
        .for("update");
      if (!f) throw new AppError("notFound");
      previous = f.photoKey;
      const [updated] = await tx.update(runFindings).set({ photoKey: picture.key }).where(eq(runFindings.id, f.id)).returning();
      await recordRunEvent(tx, run.id, actor, "finding", run.version, [{ field: "photo", from: f.photoKey ? "photo" : null, to: fileName ?? "photo" }], {
        findingId: f.id,
        kind: f.kind,
        stampCode: f.stampCode,
        photo: true,
      });
      return updated;
    });
    await deletePictureQuietly(previous);
    return toFindingDto(row);
  } catch (error) {
    await deletePictureQuietly(picture.key);
    throw error;
  }
}

/** The stored photo (or its thumbnail) of a finding, as a streamed object; everyone who reads runs may see it. */
export async function findingPhoto(actor: Actor, runId: string, findingId: string, variant: "original" | "thumb"): Promise<Response> {
  assertCan(actor, "data:read");
  const finding = await findingOf(runId, findingId);
  if (!finding.photoKey) throw new AppError("notFound");
  // Only a key the picture store made for this finding is read (a photoKey sent with the finding itself is not).
  return pictureResponse("findings", owner(runId, findingId), finding.photoKey, variant);
}
