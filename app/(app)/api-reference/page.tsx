import type { Metadata } from "next";
import { getLocale, getTranslations } from "next-intl/server";
import { routeModules } from "@/app/api/v1/route-index";
import { PageHeader, Panel } from "@/components/ui/panel";
import { openApiDocument } from "@/lib/api/openapi";
import { env } from "@/lib/env";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { requirePageActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("apiDocs.page"))("title") };
}

type Schema = { type?: string | string[]; enum?: unknown[]; properties?: Record<string, Schema>; required?: string[]; items?: Schema; anyOf?: Schema[] };
type Parameter = { name: string; in: string; required: boolean; schema: Schema };
type Operation = {
  operationId: string;
  summary: string;
  "x-roles": string[];
  parameters: Parameter[];
  requestBody?: { content: Record<string, { schema: Schema }> };
  responses: Record<string, unknown>;
};

/** A schema's type as a short word: "string", "number", "one of a | b", "list of string". */
function typeOf(schema: Schema | undefined): string {
  if (!schema) return "";
  if (schema.enum) return schema.enum.map(String).join(" | ");
  if (schema.anyOf) return schema.anyOf.map(typeOf).filter(Boolean).join(" | ");
  if (schema.type === "array") return `${typeOf(schema.items)}[]`;
  return Array.isArray(schema.type) ? schema.type.join(" | ") : (schema.type ?? "object");
}

function FieldTable({ rows, labels }: { rows: { name: string; type: string; required: boolean }[]; labels: { field: string; type: string; required: string; optional: string } }) {
  return (
    <table className="mt-1 w-full text-left text-sm">
      <thead className="text-xs text-stone-600">
        <tr>
          <th className="py-1 pr-3 font-medium">{labels.field}</th>
          <th className="py-1 pr-3 font-medium">{labels.type}</th>
          <th className="py-1 font-medium" />
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.name} className="border-t border-stone-100">
            <td className="py-1 pr-3 font-mono text-xs">{r.name}</td>
            <td className="py-1 pr-3 font-mono text-xs text-stone-700">{r.type}</td>
            <td className="py-1 text-xs text-stone-600">{r.required ? labels.required : labels.optional}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** The API reference for people who script against Capgrid: the same document as /api/v1/openapi.json, readable. */
export default async function ApiReferencePage() {
  await requirePageActor();
  const t = await getTranslations("apiDocs.page");
  const doc = openApiDocument(routeModules, translator(pickLocale(await getLocale())), env().APP_URL);
  const labels = { field: t("field"), type: t("type"), required: t("required"), optional: t("optional") };
  const groups = new Map<string, { path: string; method: string; op: Operation }[]>();
  for (const [path, ops] of Object.entries(doc.paths)) {
    for (const [method, op] of Object.entries(ops as Record<string, Operation>)) {
      const tag = path.split("/")[3] ?? "api";
      groups.set(tag, [...(groups.get(tag) ?? []), { path, method, op }]);
    }
  }
  return (
    <>
      <PageHeader
        title={t("title")}
        intro={t("intro", { url: "/api/v1/openapi.json" })}
        actions={
          <a href="/api/v1/openapi.json" className="rounded-md border border-stone-300 px-3 py-1.5 text-sm text-stone-800 hover:bg-stone-50">
            {t("openMachineReadable")}
          </a>
        }
      />
      <nav aria-label={t("onThisPage")} className="mb-6 flex flex-wrap gap-2 text-sm">
        {[...groups.keys()].map((tag) => (
          <a key={tag} href={`#${tag}`} className="rounded-full bg-stone-100 px-3 py-1 font-mono text-stone-800 hover:bg-stone-200">
            {tag}
          </a>
        ))}
      </nav>
      <div className="space-y-6">
        {[...groups.entries()].map(([tag, ops]) => (
          <Panel key={tag} title={`/api/v1/${tag}`}>
            <div id={tag} className="space-y-5">
              {ops.map(({ path, method, op }) => {
                const body = op.requestBody?.content["application/json"]?.schema;
                const csv = op.requestBody?.content["text/csv"];
                const section = (place: string) => op.parameters.filter((p) => p.in === place).map((p) => ({ name: p.name, type: typeOf(p.schema), required: p.required }));
                return (
                  <article key={`${method} ${path}`} className="border-t border-stone-100 pt-4 first:border-0 first:pt-0">
                    <h3 className="font-mono text-sm">
                      <span className="mr-2 rounded bg-stone-800 px-1.5 py-0.5 text-xs font-semibold text-white uppercase">{method}</span>
                      {path}
                    </h3>
                    <p className="mt-1 text-sm text-stone-800">{op.summary}</p>
                    <p className="mt-1 text-xs text-stone-600">{t("whoMay", { roles: op["x-roles"].join(", ") })}</p>
                    {section("path").length ? (
                      <>
                        <h4 className="mt-3 text-xs font-semibold text-stone-700 uppercase">{t("pathParameters")}</h4>
                        <FieldTable rows={section("path")} labels={labels} />
                      </>
                    ) : null}
                    {section("query").length ? (
                      <>
                        <h4 className="mt-3 text-xs font-semibold text-stone-700 uppercase">{t("queryParameters")}</h4>
                        <FieldTable rows={section("query")} labels={labels} />
                      </>
                    ) : null}
                    {body?.properties ? (
                      <>
                        <h4 className="mt-3 text-xs font-semibold text-stone-700 uppercase">{t("body")}</h4>
                        <FieldTable
                          rows={Object.entries(body.properties).map(([name, s]) => ({ name, type: typeOf(s), required: (body.required ?? []).includes(name) }))}
                          labels={labels}
                        />
                      </>
                    ) : null}
                    {csv ? <p className="mt-3 text-xs text-stone-700">{t("csvBody")}</p> : null}
                    <p className="mt-3 text-xs text-stone-600">
                      {t("answers")}: <span className="font-mono">{Object.keys(op.responses).join(", ")}</span>
                    </p>
                  </article>
                );
              })}
            </div>
          </Panel>
        ))}
      </div>
    </>
  );
}
