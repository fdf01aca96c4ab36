import type { Translator } from "@/lib/i18n/translator";

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/**
 * The 403 page proxy.ts answers a form or server action posted from another origin with: the same
 * words and shape as the app's message pages (components/shell/message-page.tsx), as a complete
 * document of its own, styled under the answer's CSP nonce.
 */
export function refusedPage(t: Translator, locale: string, nonce: string): string {
  const title = escapeHtml(t("common.crossSiteTitle"));
  return `<!DOCTYPE html>
<html lang="${escapeHtml(locale)}"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title} · ${escapeHtml(t("app.name"))}</title>
<style nonce="${nonce}">
body{margin:0;font-family:system-ui,sans-serif;color:#1c1917;background:#fafaf9}
main{max-width:32rem;margin:0 auto;padding:4rem 1rem;text-align:center}
h1{font-size:1.25rem;font-weight:600;margin:0}
p{margin:.5rem 0 0;font-size:.875rem;color:#57534e}
a{display:inline-block;margin-top:1.5rem;font-size:.875rem;color:#2f3f7a;text-decoration:none}
a:hover{text-decoration:underline}
</style></head>
<body><main><h1>${title}</h1><p>${escapeHtml(t("errors.crossSite"))}</p><p>${escapeHtml(t("common.crossSiteBody"))}</p><a href="/">${escapeHtml(t("common.backHome"))}</a></main></body></html>`;
}
