import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig, type HtmlTagDescriptor, type Plugin } from 'vite';

/** Where the dev server forwards /api; the api listens on :3000 unless told otherwise. */
const apiOrigin = process.env.GLOAMING_API_ORIGIN ?? 'http://localhost:3000';

/** The one module main.tsx loads with import(): React and the pages. */
const APP_MODULE = 'src/app/mount-portal.tsx';
/** The faces every page shows above the fold (IBM Plex Sans 400 and 600, Latin subset). */
const FIRST_PAINT_FONTS = [/^ibm-plex-sans-latin-400-normal-.*\.woff2$/, /^ibm-plex-sans-latin-600-normal-.*\.woff2$/];

/**
 * index.html names the page's code and its two fonts up front (modulepreload / preload), so
 * the phone fetches them alongside the small entry module instead of one after another:
 * HTML -> (entry, app, CSS, fonts, and the quote's GET from the entry) -> paint.
 */
function preloadFirstPaint(): Plugin {
  let base = '/';
  return {
    name: 'gloaming-portal-preload-first-paint',
    apply: 'build',
    configResolved(config) {
      base = config.base;
    },
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        const bundle = ctx.bundle;
        if (!bundle) return [];
        const tags: HtmlTagDescriptor[] = [];
        const app = Object.values(bundle).find((c) => c.type === 'chunk' && c.facadeModuleId?.endsWith(APP_MODULE));
        if (!app || app.type !== 'chunk') throw new Error(`the build has no chunk for ${APP_MODULE}`);
        // the entry chunk is already in the page as its module script
        const entries = new Set(Object.values(bundle).flatMap((c) => (c.type === 'chunk' && c.isEntry ? [c.fileName] : [])));
        for (const file of [app.fileName, ...app.imports].filter((f) => !entries.has(f)))
          tags.push({ tag: 'link', attrs: { rel: 'modulepreload', crossorigin: true, href: `${base}${file}` }, injectTo: 'head' });
        for (const pattern of FIRST_PAINT_FONTS) {
          const font = Object.values(bundle).find((a) => a.type === 'asset' && pattern.test(a.fileName.replace(/^assets\//, '')));
          if (!font) throw new Error(`the build has no font matching ${pattern.source}`);
          tags.push({
            tag: 'link',
            attrs: { rel: 'preload', as: 'font', type: 'font/woff2', crossorigin: true, href: `${base}${font.fileName}` },
            injectTo: 'head',
          });
        }
        return tags;
      },
    },
  };
}

export default defineConfig({
  // The api serves this build under /portal/ in production.
  base: '/portal/',
  plugins: [react(), tailwindcss(), preloadFirstPaint()],
  server: {
    port: 5174,
    strictPort: true,
    proxy: { '/api': { target: apiOrigin, changeOrigin: false } },
  },
  preview: {
    port: 4174,
    proxy: { '/api': { target: apiOrigin, changeOrigin: false } },
  },
});
