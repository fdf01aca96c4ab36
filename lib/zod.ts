import { z } from "zod";

// The schemas run in the browser too, under a Content-Security-Policy without 'unsafe-eval' (proxy.ts).
// zod would compile object parsers with new Function, and even its probe for that is reported as a
// violation: it must be told not to before any schema is built, so every schema module (lib/validation, and the pure domains' own schemas) imports z from here.
z.config({ jitless: true });

export { z };
