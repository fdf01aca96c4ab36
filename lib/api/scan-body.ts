import "server-only";
import type { ValidationFailed } from "@/lib/errors";
import { ScanRejected } from "@/lib/scans";
import { MAX_FILE_NAME_LENGTH } from "@/lib/scans/file-name";
import { controlCharacterMessage } from "@/lib/validation/parse";

/**
 * A scan route's refused body: a file name the shared control-character rule refuses is reported the
 * way lib/scans refuses every hidden character in a name (bidirectional overrides too), as badFileName,
 * the refusal the uploader already explains. Any other refusal stays as it is.
 */
export function scanBodyRefusal(error: ValidationFailed): Error | undefined {
  const hidden = error.issues.some((i) => i.path.join(".") === "fileName" && i.message === controlCharacterMessage);
  return hidden ? new ScanRejected("badFileName", { reason: "hiddenCharacters", maxLength: MAX_FILE_NAME_LENGTH }) : undefined;
}
