import { config } from 'zod/v4/core';

// The app's content security policy allows no eval. Zod compiles fast parsers with
// `new Function` and probes for it when a schema is built; the browser reports that
// probe as a policy violation even though zod falls back. In the browser the setup
// schema runs without compiling (a setup is a few kilobytes, so the interpreted parse
// is quick). main.tsx imports this first, so the setting is in place before any screen
// builds a schema.
config({ jitless: true });
