import "server-only";
import type { Actor } from "@/lib/authz";
import type { RunFindingDto } from "@/lib/contracts/runs";

// A quality finding's photo: checked like a scan (lib/scans), stored in the object store with a thumbnail,
// its key on the finding. (The picture store shared with new-stamp sketches is built next; these are its seams.)

/** Checks and stores the photo of one of the run's findings (who may record findings may add its photo). */
export async function attachFindingPhoto(_actor: Actor, _runId: string, _findingId: string, _bytes: Uint8Array, _fileName?: string): Promise<RunFindingDto> {
  throw new Error("attachFindingPhoto is not built yet");
}

/** The stored photo (or its thumbnail) of a finding, as a streamed object; everyone who reads runs may see it. */
export async function findingPhoto(_actor: Actor, _runId: string, _findingId: string, _variant: "original" | "thumb"): Promise<Response> {
  throw new Error("findingPhoto is not built yet");
}
