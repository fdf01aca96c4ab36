import "server-only";
import { AppError, type ValidationFailed } from "@/lib/errors";
import { scanLimits } from "@/lib/data/scans";
import { readBodyBytes } from "./body";
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

/**
 * The picture in a request's body (a sketch, a finding's photo), read with the scan limit counted while reading:
 * more than that is refused as the scan refusal `tooLarge` (413), before anything is decoded or stored.
 */
export async function readPictureBody(request: Request): Promise<Buffer> {
  const maxBytes = scanLimits().maxBytes;
  try {
    return await readBodyBytes(request, maxBytes);
  } catch (error) {
    if (error instanceof AppError && error.code === "payloadTooLarge") throw new ScanRejected("tooLarge", { maxBytes });
    throw error;
  }
}
