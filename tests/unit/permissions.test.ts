import { describe, expect, it } from "vitest";
import { can, permissionTable, roles } from "@/lib/permissions";

// The rows of SPEC section 2, written out again by hand so a slip in the table shows here.
const spec: Record<string, string[]> = {
  "users:manage": ["admin"],
  "settings:manage": ["admin"], // workshop settings (time zone, currency, cloth presets, stamping rate)
  "stamps:write": ["admin", "keeper"],
  "stamps:request": ["admin", "keeper", "planner", "waxmaster", "designer"],
  "stamps:requestNew": ["admin", "keeper", "planner", "designer"], // request a new stamp (planners: request only)
  "plans:write": ["admin", "planner"],
  "wax:write": ["admin", "waxmaster"],
  "motifs:write": ["admin", "keeper", "designer"],
  "runs:write": ["admin", "planner"], // create/edit production runs and their stages (and record dye and bleach progress)
  "runs:recordWaxing": ["admin", "waxmaster"], // record a waxing stage's wax, pot temperatures, the boil-off
  "runs:recordFindings": ["admin", "keeper", "planner", "waxmaster"], // record quality findings on a run
  "data:read": ["admin", "keeper", "planner", "waxmaster", "designer"],
};

describe("permission table", () => {
  it.each(Object.entries(spec))("%s follows SPEC section 2", (permission, allowed) => {
    for (const role of roles) expect(can(role, permission as keyof typeof permissionTable), `${role} ${permission}`).toBe(allowed.includes(role));
  });

  it("has no permission that SPEC section 2 does not name, besides keeping one's own account", () => {
    expect(Object.keys(permissionTable).sort()).toEqual([...Object.keys(spec), "account:self"].sort());
  });
});
