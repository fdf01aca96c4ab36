import type { Role } from "@/db/schema";

export const roles = ["admin", "keeper", "planner", "waxmaster", "designer"] as const satisfies readonly Role[];
export type { Role };

/** Who may do what (SPEC section 2). The one table every server-side check reads. */
export const permissionTable = {
  "users:manage": ["admin"],
  "settings:manage": ["admin"],
  "stamps:write": ["admin", "keeper"],
  "stamps:request": ["admin", "keeper", "planner", "waxmaster", "designer"],
  "stamps:requestNew": ["admin", "keeper", "planner", "designer"],
  "plans:write": ["admin", "planner"],
  "wax:write": ["admin", "waxmaster"],
  "motifs:write": ["admin", "keeper", "designer"],
  "runs:write": ["admin", "planner"],
  "runs:recordWaxing": ["admin", "waxmaster"],
  "runs:recordFindings": ["admin", "keeper", "planner", "waxmaster"],
  "data:read": ["admin", "keeper", "planner", "waxmaster", "designer"],
  "account:self": ["admin", "keeper", "planner", "waxmaster", "designer"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof permissionTable;

export function can(role: Role, permission: Permission): boolean {
  return (permissionTable[permission] as readonly Role[]).includes(role);
}

export function permissionsOf(role: Role): Permission[] {
  return (Object.keys(permissionTable) as Permission[]).filter((p) => can(role, p));
}
