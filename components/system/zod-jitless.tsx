"use client";

import { z } from "zod";

// zod 4 probes `new Function` on its first parse to decide whether to compile parsers; under the pages'
// Content-Security-Policy (no 'unsafe-eval') the probe is blocked and reported as a violation. Parsing
// without compiling avoids the probe; forms parse small objects, so nothing is lost.
z.config({ jitless: true });

/** Renders nothing; importing it on every page sets zod's configuration before any form parses. */
export function ZodJitless() {
  return null;
}
