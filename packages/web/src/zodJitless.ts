// Imported first by main.tsx, before any module that parses with zod at load time.
// The server's Content-Security-Policy forbids eval; zod's speed-up probes `new Function` once,
// which the browser reports as a CSP violation even though zod catches it. Skip the probe.
import { z } from 'zod';

z.config({ jitless: true });
