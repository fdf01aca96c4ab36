import { getTranslations } from "next-intl/server";

// i18n-keys: waxRoom.safety.*
const cautions = ["burns", "fire", "fumes", "clothing", "water", "floors"] as const;

/** The cautions every wax screen shows (SPEC 5.3), and who decides: codes, the supplier's SDS, licensed practice. */
export async function SafetyCautions() {
  const t = await getTranslations("waxRoom.safety");
  return (
    <section aria-labelledby="wax-safety-title" data-testid="wax-safety" className="mb-6 rounded-lg border border-amber-300 bg-amber-50 px-4 py-3 text-amber-950 print:border-stone-400 print:bg-white">
      <h2 id="wax-safety-title" className="text-sm font-semibold">
        {t("title")}
      </h2>
      <ul className="mt-2 grid gap-x-6 gap-y-1 text-xs sm:grid-cols-2 lg:grid-cols-3">
        {cautions.map((c) => (
          <li key={c} data-caution={c}>
            <span className="font-semibold">{t(`${c}.title`)}</span> {t(`${c}.body`)}
          </li>
        ))}
      </ul>
      <p className="mt-2 text-xs font-medium" data-testid="wax-safety-decides">
        {t("decides")}
      </p>
    </section>
  );
}
