// Loaded by index.html as a classic script, so it runs before any module of the app: zod then
// validates without generating code. zod compiles fast paths with `new Function` and, to find
// out whether it may, tries one as each object schema is built; under the content security
// policy (script-src 'self', no 'unsafe-eval') that try is blocked and reported as a violation
// even though zod catches it. An import at the top of the app's entry is not early enough once
// the bundle is split: the chunks an entry imports (zod and the schemas among them) run before
// the entry's own code. zod adopts this global configuration object when it loads.
(globalThis.__zod_globalConfig ??= {}).jitless = true;
