/**
 * The life of a stamp's condition. Damage is reported by anyone; keepers then move the stamp
 * needs repair → in repair → sound (or worn), or retire it. Pure: no database, no framework.
 */

export type Condition = "sound" | "worn" | "needs_repair" | "in_repair" | "retired";

const next: Record<Condition, readonly Condition[]> = {
  sound: ["worn", "needs_repair", "retired"],
  worn: ["sound", "needs_repair", "retired"],
  // A report can turn out to be a false alarm: back to sound or worn without a repair.
  needs_repair: ["in_repair", "sound", "worn", "retired"],
  in_repair: ["sound", "worn", "needs_repair", "retired"],
  retired: ["sound", "worn", "needs_repair"],
};

/** The conditions a stamp may move to from `from`. */
export function nextConditions(from: Condition): readonly Condition[] {
  return next[from];
}

export function canChangeCondition(from: Condition, to: Condition): boolean {
  return next[from].includes(to);
}

/** Leaving the workshop bench for use again: this closes the open damage reports. */
export function isRepair(from: Condition, to: Condition): boolean {
  return from === "in_repair" && (to === "sound" || to === "worn");
}

/** Stamps in these conditions stay on the shelf: they cannot be checked out. */
export function canBeCheckedOut(condition: Condition): boolean {
  return condition === "sound" || condition === "worn";
}

/** A stamp that is out must come back before it goes to repair or is retired. */
export function needsToBeIn(to: Condition): boolean {
  return to === "in_repair" || to === "retired";
}
