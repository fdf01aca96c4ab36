"use client";

import { useTranslations } from "next-intl";
import { Button } from "@/components/ui/button";

export default function AreaError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const t = useTranslations();
  return (
    <div role="alert" className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-xl font-semibold">{t("common.error")}</h1>
      <p className="mt-2 text-sm text-stone-600">{t("errors.internal")}</p>
      <Button className="mt-6" onClick={reset}>
        {t("common.retry")}
      </Button>
    </div>
  );
}
