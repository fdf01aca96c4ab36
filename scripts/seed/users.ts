import type { Database } from "@/db";
import { users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/passwords";

/** Invented people of the demo workshop, one per role; passwords are for local development only. */
export const demoUsers: { email: string; name: string; role: Role; password: string }[] = [
  { email: "arum@capgrid.test", name: "Arum Kencanawati", role: "admin", password: "demo-admin-2026" },
  { email: "joko@capgrid.test", name: "Joko Samudro", role: "keeper", password: "demo-keeper-2026" },
  { email: "laras@capgrid.test", name: "Laras Prameswari", role: "planner", password: "demo-planner-2026" },
  { email: "tirta@capgrid.test", name: "Tirta Wicaksana", role: "waxmaster", password: "demo-waxmaster-2026" },
  { email: "sekar@capgrid.test", name: "Sekar Ayuningtyas", role: "designer", password: "demo-designer-2026" },
];

/** Adds the demo people who are missing; leaves anyone already there untouched. */
export async function seedUsers(db: Database) {
  for (const user of demoUsers) {
    await db
      .insert(users)
      .values({ email: user.email, name: user.name, role: user.role, passwordHash: await hashPassword(user.password) })
      .onConflictDoNothing();
  }
}
