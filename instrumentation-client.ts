// Runs in the browser before any of the app's own modules (Next.js loads it first). zod 4 probes for
// eval (`Function("")`) when it builds an object schema, to compile a faster parser; the CSP refuses
// eval (proxy.ts) and reports each probe as a violation. Jitless mode skips the probe: the same
// parsing, without generated code.
import { z } from "zod";

z.config({ jitless: true });
