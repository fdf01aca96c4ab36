// POST /api/v1/checkouts/reminders — e-mail every borrower whose check-out is overdue (keepers)
import { apiRoute, methods } from "@/lib/api/route";
import { sendOverdueReminders } from "@/lib/data/stamps/mail";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  POST: apiRoute({ operation: "sendOverdueReminders", permission: "stamps:write" }, async ({ actor }) => ({ reminders: await sendOverdueReminders(actor) })),
});
