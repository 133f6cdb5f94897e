import { describe, expect, it } from 'vitest';
import type { InstallerPackPdfModel, PackPdfCircuit } from '../src/modules/quote-pdf/installer-pack-model';
import { renderInstallerPackPdf } from '../src/modules/quote-pdf/render-installer-pack-pdf';
import { pdfPages } from './support/pdf-text';


function circuit(title: string, steps: number): PackPdfCircuit {
  return {
    title,
    kind: 'Constant current, series string',
    power: 'Test driver 350 mA',
    summary: '3 fittings',
    diagram: null,
    runDiagram: null,
    schedules: [],
    steps: Array.from({ length: steps }, (_, i) => `Step ${i + 1} of ${title}: land the cores at the block and check the seal.`),
    runs: null,
    pick: {
      title: 'Pick list for this circuit',
      head: ['Item', 'Code', 'Quantity', 'Where'],
      rows: [['Spike light 3 W', 'SP-3', '3', 'Van']],
    },
    readings: [{ label: 'Output current at the driver', expected: '0.35 A', range: '0.33–0.37 A', measured: '', flag: '' }],
    checks: [{ label: 'Polarity checked at every block', done: false }],
    note: '',
    asWired: null,
  };
}

function model(circuits: PackPdfCircuit[]): InstallerPackPdfModel {
  return {
    firmName: 'Test Lighting Ltd',
    reference: 'Q-0001',
    title: 'Test garden',
    revision: 1,
    status: 'Approved',
    printedOn: '1 January 2026',
    customer: { name: 'A Customer', phone: '' },
    site: { label: 'Garden', lines: ['1 Test Lane'], accessNotes: '' },
    caution: 'Mains work is for a licensed electrician.',
    loads: [],
    circuits,
  };
}

describe("installer's pack PDF page numbers", () => {
  // The footer is painted while the PDF is written and its total comes from the last page
  // element: a last circuit running over several pages, or no circuits at all, must still
  // number every page out of the right total.
  it('numbers every page out of the total when the last circuit runs over several pages', async () => {
    const pages = await pdfPages(await renderInstallerPackPdf(model([circuit('Front path', 4), circuit('Back wall', 160)])), { squeeze: true });
    expect(pages.length).toBeGreaterThanOrEqual(5);
    pages.forEach((page, i) => expect(page).toContain(`Q-0001 installer’s pack · no prices · page ${i + 1} of ${pages.length}`));
    expect(pages.filter((page) => /^Circuit \d+\. /.test(page)).map((page) => /^Circuit (\d+)/.exec(page)![1])).toEqual([
      '1',
      '2',
    ]);
    expect(pages.join(' ')).toContain('Step 160 of Back wall');
  }, 30_000);

  it('numbers the single page of a pack with no circuits', async () => {
    const pages = await pdfPages(await renderInstallerPackPdf(model([])), { squeeze: true });
    expect(pages).toHaveLength(1);
    expect(pages[0]).toContain('This job has no circuits designed yet.');
    expect(pages[0]).toContain('page 1 of 1');
  }, 30_000);
});
