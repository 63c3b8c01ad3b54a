// Imported first by main.tsx, before any schema is built: zod would otherwise probe `new Function`
// to compile its object parsers, which the pages' Content-Security-Policy (no 'unsafe-eval')
// refuses and reports as a violation. Without it zod parses the same, by interpretation.
import { config } from "zod";

config({ jitless: true });
