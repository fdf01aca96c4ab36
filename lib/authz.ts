import type { Role, User } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { can, type Permission } from "@/lib/permissions";
import { audit } from "./log";

/** The person acting, as the data-access layer sees them: always re-read from the database. */
export interface Actor {
  id: string;
  email: string;
  name: string;
  role: Role;
  unitSystem: User["unitSystem"];
  locale: User["locale"];
  via: "session" | "token";
}

export const toActor = (user: User, via: Actor["via"] = "session"): Actor => ({
  id: user.id,
  email: user.email,
  name: user.name,
  role: user.role,
  unitSystem: user.unitSystem,
  locale: user.locale,
  via,
});

/** Throws 403 unless the actor's role has the permission (lib/permissions.ts). */
export function assertCan(actor: Actor, permission: Permission) {
  if (can(actor.role, permission)) return;
  audit("permission.denied", actor, { permission });
  throw new AppError("forbidden");
}
