import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { database } from "@/db";
import { users, type NewUser, type Role, type User } from "@/db/schema";
import { hashPassword } from "@/lib/auth/passwords";

export const db = () => database().db;

export const uniqueEmail = (label: string) => `${label}-${randomBytes(4).toString("hex")}@capgrid.test`;

/** A user straight in the database, with a known password. */
export async function createUser(role: Role, password = "correct horse battery", values: Partial<NewUser> = {}): Promise<User & { password: string }> {
  const [user] = await db()
    .insert(users)
    .values({ email: uniqueEmail(role), name: `Test ${role}`, role, passwordHash: await hashPassword(password), ...values })
    .returning();
  return { ...user, password };
}

export async function reloadUser(id: string): Promise<User> {
  const [user] = await db().select().from(users).where(eq(users.id, id));
  return user;
}

