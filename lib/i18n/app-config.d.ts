import type { dateTimeFormats, numberFormats } from "./formats";
import type enApi from "./messages/en/api.json";
import type enAuth from "./messages/en/auth.json";
import type enEmails from "./messages/en/emails.json";
import type enErrors from "./messages/en/errors.json";
import type enLayout from "./messages/en/layout.json";
import type enPeople from "./messages/en/people.json";
import type enPlans from "./messages/en/plans.json";
import type enRequests from "./messages/en/requests.json";
import type enScans from "./messages/en/scans.json";
import type enShell from "./messages/en/shell.json";
import type enStamps from "./messages/en/stamps.json";
import type enWax from "./messages/en/wax.json";
import type enWaxRoom from "./messages/en/wax-room.json";
import type enMotifs from "./messages/en/motifs.json";
import type enRuns from "./messages/en/runs.json";
import type enOverview from "./messages/en/overview.json";

// Message keys are typed from the English catalogue: a key that does not exist (also one built
// from a template) fails `npm run typecheck`.
declare module "next-intl" {
  interface AppConfig {
    Formats: { dateTime: typeof dateTimeFormats; number: typeof numberFormats };
    Messages: typeof enApi & typeof enAuth & typeof enEmails & typeof enErrors & typeof enLayout & typeof enPeople & typeof enPlans & typeof enRequests & typeof enScans & typeof enShell & typeof enStamps & typeof enWax & typeof enWaxRoom & typeof enMotifs & typeof enRuns & typeof enOverview;
  }
}
