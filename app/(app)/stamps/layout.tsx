import { ShelfTabs } from "@/components/stamps/shelf-tabs";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

export default async function StampShelfLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  return (
    <>
      <ShelfTabs canWrite={can(actor.role, "stamps:write")} />
      {children}
    </>
  );
}
