import { defineConfig } from 'tsup';

/**
 * The api is bundled into one ESM file for `npm start`: our workspace packages (TypeScript
 * sources) are compiled in; every third-party package stays external and loads from
 * node_modules (native addons such as argon2 and sqlite3 cannot be bundled).
 */
export default defineConfig({
  // the quote PDF renders in a worker thread: its entry sits beside main.js
  entry: { main: 'src/main.ts', 'pdf-worker': 'src/modules/quote-pdf/pdf-worker.ts' },
  format: ['esm'],
  platform: 'node',
  target: 'node20',
  outDir: 'dist',
  clean: true,
  sourcemap: true,
  splitting: false,
  noExternal: [/^@gloaming\//],
  esbuildPlugins: [
    {
      name: 'third-party-external',
      setup(build) {
        build.onResolve({ filter: /^[^./]/ }, (args) => {
          if (args.path.startsWith('@gloaming/')) return undefined;
          return { path: args.path, external: true };
        });
      },
    },
  ],
});
