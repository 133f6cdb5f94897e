import '@fontsource/ibm-plex-sans/400.css';
import '@fontsource/ibm-plex-sans/600.css';
import './styles/theme.css';
import { matchPortalRoute } from './app/portal-route';
import { startQuoteFetch } from './features/quote/api/early-quote';

/*
 * The entry module is kept small: it asks for the quote straight away, while React and the
 * pages (app/mount-portal, preloaded by index.html) are still downloading. index.html's shell
 * stays on screen until both have arrived, so the quote is rendered once, complete.
 */
const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element.');

const route = matchPortalRoute(window.location.pathname, window.location.search);
const quote = route.kind === 'quote' ? startQuoteFetch(route.token) : Promise.resolve(undefined);

Promise.all([import('./app/mount-portal'), quote])
  .then(([{ mountPortal }, ready]) => mountPortal(root, route, ready))
  .catch(() => {
    const message = document.createElement('p');
    message.setAttribute('role', 'alert');
    message.className = 'p-6';
    message.textContent = 'This page could not load. Check your connection and reload the page.';
    root.replaceChildren(message);
  });
