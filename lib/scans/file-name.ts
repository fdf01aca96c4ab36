import { scanExtensions, type ScanType } from "./detect-type";
import { ScanRejected } from "./errors";

export const MAX_FILE_NAME_LENGTH = 255;

// C0 and C1 controls, DEL, and the bidirectional overrides that make "scan‮gnp.exe" read as "scanexe.png".
const UNSAFE_CHARS = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;

/**
 * Refuses an upload's file name that carries path parts or hidden characters: "/", "\", a name of "." or "..",
 * control or bidirectional-override characters, empty, or longer than 255 characters. Browsers send only a
 * base name, so such a name means a crafted request. Names never become storage keys either way.
 */
export function checkFileName(name: string): void {
  const reason =
    name.trim() === ""
      ? "empty"
      : name.length > MAX_FILE_NAME_LENGTH
        ? "tooLong"
        : /[/\\]/.test(name) || name === "." || name === ".."
          ? "path"
          : UNSAFE_CHARS.test(name)
            ? "hiddenCharacters"
            : null;
  if (reason) throw new ScanRejected("badFileName", { reason, maxLength: MAX_FILE_NAME_LENGTH });
}

/**
 * A safe name for downloading a stored scan: the base name of what the keeper uploaded, without unsafe or
 * quoting characters, at most 100 characters before the extension, and the extension of the real content.
 */
export function downloadFileName(uploadedName: string | null | undefined, type: ScanType, fallbackStem = "scan"): string {
  const base = (uploadedName ?? "").split(/[/\\]/).pop() ?? "";
  const cleaned = base
    .replace(new RegExp(UNSAFE_CHARS.source, "g"), "")
    .replace(/["';*?<>|:]/g, "_")
    .trim();
  const stem = cleaned.replace(/\.[^.]*$/, "").replace(/^\.+/, "").slice(0, 100).trim();
  return `${stem || fallbackStem}.${scanExtensions[type]}`;
}
