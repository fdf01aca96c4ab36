/** Set by scripts/test.ts; running these suites outside `npm test` has no app to talk to. */
export function testEnv() {
  const appUrl = process.env.APP_URL;
  const mailUrl = process.env.MAIL_VIEWER_URL;
  if (!appUrl || !mailUrl || !process.env.NEXT_DIST_DIR?.startsWith(".next-test")) {
    throw new Error("Run the integration and browser tests through `npm test` (it starts the database, the fakes and the app).");
  }
  return { appUrl, mailUrl };
}
