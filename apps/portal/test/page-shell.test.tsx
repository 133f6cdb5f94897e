import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { PageShell, SHELL_STATUS } from '../src/components/ui/page-shell';

const indexHtml = readFileSync(join(__dirname, '../index.html'), 'utf8');
const shell = () => new DOMParser().parseFromString(indexHtml, 'text/html').querySelector('#root');

describe('the page shell in index.html', () => {
  it('is exactly what PageShell renders, so the first paint and React agree', () => {
    expect(shell()?.innerHTML).toBe(renderToStaticMarkup(<PageShell status={SHELL_STATUS} />));
  });

  it('says the page is loading in a status line, and names no firm or price', () => {
    expect(shell()?.querySelector('[role="status"]')?.textContent).toBe('Loading…');
    expect(shell()?.textContent).toBe('Your lighting quoteLoading…');
  });
});
