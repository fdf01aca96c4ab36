"use server";

import { auth, signOut } from "@/lib/auth/config";
import { revokeSession } from "@/lib/data/sessions";

/** The header's Sign out: the session's row is revoked first, so a copy of the cookie stops working too. */
export async function signOutAction() {
  await revokeSession((await auth())?.user?.sessionId);
  await signOut({ redirectTo: "/signin" });
}
