// POST /api/v1/checkouts/reminders — e-mail every borrower whose check-out is overdue (keepers)
import { apiRoute } from "@/lib/api/route";
import { sendOverdueReminders } from "@/lib/data/stamp-mail";

export const POST = apiRoute({ permission: "stamps:write" }, async ({ actor }) => ({ reminders: await sendOverdueReminders(actor) }));
