import type { Permission } from "@/lib/permissions";

/** The areas in the navigation; add an area here when its pages exist. */
export const navItems: { href: string; labelKey: "home" | "stamps" | "plans" | "wax" | "motifs" | "runs" | "admin"; permission: Permission }[] = [
  { href: "/", labelKey: "home", permission: "data:read" },
  { href: "/stamps", labelKey: "stamps", permission: "data:read" },
  { href: "/plans", labelKey: "plans", permission: "data:read" },
  { href: "/wax", labelKey: "wax", permission: "data:read" },
  { href: "/motifs", labelKey: "motifs", permission: "data:read" },
  { href: "/runs", labelKey: "runs", permission: "data:read" },
  { href: "/admin", labelKey: "admin", permission: "users:manage" },
];
