/**
 * Imported first by the client's entry and by each Web Worker entry: tells zod not to compile
 * parsers with `new Function`. Under the server's Content-Security-Policy (no 'unsafe-eval')
 * zod's probe for that would be reported as a CSP violation even though zod catches the error;
 * with `jitless` there is no probe and parsing works the same (a little slower on huge inputs).
 */
import { z } from "zod";

z.config({ jitless: true });
