/**
 * Import first in a browser bundle, for its side effect: zod then validates without generating
 * code. zod compiles fast paths with `new Function` and, to find out whether it may, tries one
 * as each object schema is built; under our content security policy (script-src 'self', no
 * 'unsafe-eval') that try is blocked and reported as a violation even though zod catches it.
 * So this must run before any schema is built: it is a subpath of its own
 * (`@gloaming/contracts/browser-validation`) that loads nothing but zod. The api keeps the
 * fast paths.
 */
import { z } from 'zod';

z.config({ jitless: true });
