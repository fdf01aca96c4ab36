"use server";

import { signOut } from "@/lib/auth/config";

/** The header's sign-out button: ends the session and goes to the sign-in page. */
export async function signOutAction() {
  await signOut({ redirectTo: "/signin" });
}
