import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { linkLifetime } from "@/lib/data/users";
import { ForgotForm } from "./forgot-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("forgot"))("title") };
}

export default function ForgotPasswordPage() {
  return <ForgotForm minutes={linkLifetime.resetMinutes} />;
}
