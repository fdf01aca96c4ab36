import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { getStockTake } from "@/lib/data/stamps/stock-takes";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { stockTakeIdParamSchema } from "@/lib/validation/stamps";
import { StockTakeCounter } from "./counter";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("stockTake"))("title") };
}

export default async function StockTakePage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  const parsed = stockTakeIdParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const take = await getStockTake(actor, parsed.data.id).catch((error) => {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  });
  return <StockTakeCounter initial={take} canWrite={can(actor.role, "stamps:write")} />;
}
