import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { redirect } from "next/navigation";
import { currentActor } from "@/lib/session";
import { SignInForm } from "./signin-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("signin"))("title") };
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; notice?: string }> }) {
  if (await currentActor()) redirect("/");
  const { next, notice } = await searchParams;
  const t = await getTranslations("signin");
  const notices: Record<string, string> = { "password-set": t("passwordSet"), "signed-out-everywhere": t("signedOutEverywhere") };
  return <SignInForm next={next} notice={notice ? notices[notice] : undefined} />;
}
