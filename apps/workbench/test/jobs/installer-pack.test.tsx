/**
 * The installer's pack page parts: the as-wired editor runs the engine's wiring check as the
 * installer types and puts the fix beside the terminal; the commissioning form flags a
 * reading outside its range. Trade rules: series rule of thumb (common practice); an LED
 * reversed does not light (forward bias); forward voltage ± 10 % (common practice).
 */
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import type { JobPackCircuit } from '@gloaming/contracts';
import { adviseWiring, asWiredSchedule, planConnectorBlocks } from '@gloaming/engine';
import { AsWiredEditor } from '../../src/features/jobs/components/as-wired-editor';
import { CommissioningForm } from '../../src/features/jobs/components/commissioning-form';
import { json, stubFetch } from '../fetch-stub';
import { renderWithApp } from '../render';

afterEach(cleanup);

const JOB = '1d3f0c6e-52b1-4c1e-9d7a-0a0b0c0d0e0f';
const CIRCUIT = '2b1c2d3e-4f50-4617-8a9b-0c1d2e3f4a5b';

const plan = planConnectorBlocks({
  string: { fittings: ['Gate', 'Porch', 'Bench'].map((label, i) => ({ id: `f${i + 1}`, label })) },
  blockType: { name: 'Five-way gel box', terminals: 5, cableEntries: 5, conductorsPerTerminal: 2, ipCode: 'IP68' },
});

const circuit: JobPackCircuit = {
  id: CIRCUIT,
  area: 'Front path',
  name: '',
  kind: 'constant-current',
  powerName: 'Lantern 350',
  design: {
    kind: 'constant-current',
    driverProductId: null,
    driverLocation: 'driver-outdoors',
    fittings: [],
    driverLead: null,
    links: [],
    extensions: [],
    connectorBlockProductId: null,
    assignment: null,
    acknowledgements: [],
  },
  designOk: true,
  pick: { items: [], cuts: [] },
  asWired: null,
  commissioning: {
    readings: [
      {
        key: 'far-fitting-voltage',
        label: 'Voltage across the last fitting',
        unit: 'V',
        expected: 3.1,
        min: 2.79,
        max: 3.41,
        basis: '± 10 %',
        value: null,
        status: 'not-entered',
      },
    ],
    checks: [{ key: 'polarity-checked', label: 'Polarity checked', done: false }],
    note: '',
    flagged: 0,
    complete: false,
    findings: [],
    version: null,
    updatedAt: null,
    recordedBy: null,
  },
};

describe('AsWiredEditor', () => {
  it('starts from the design, checks each edit live, shows the fix beside the terminal and saves what was typed', async () => {
    const { sent } = stubFetch((r) => {
      const body = r.body as { blocks: { terminals: { conductors: string[] }[] }[] };
      const advice = adviseWiring(plan, asWiredSchedule(plan, body.blocks));
      return json(200, {
        asWired: {
          blocks: body.blocks,
          version: 1,
          updatedAt: '2026-12-01T10:00:00.000Z',
          recordedBy: 'Callum',
          advice: { ...advice, check: { ok: advice.check.ok, findings: advice.check.findings } },
        },
      });
    });
    renderWithApp(<AsWiredEditor jobId={JOB} circuit={circuit} plan={plan} />);
    expect(screen.getByTestId(`aswired-${CIRCUIT}-verdict`).textContent).toContain('Safe to power up');
    const t2 = screen.getByLabelText('Block 1 terminal 2, conductor ends connected') as HTMLInputElement;
    const t3 = screen.getByLabelText('Block 1 terminal 3, conductor ends connected') as HTMLInputElement;
    expect(t2.value).toBe('fitting:1-, fitting:2+');
    expect(t3.value).toBe('fitting:2-, fitting:3+');
    // fitting 2 landed the wrong way round
    const user = userEvent.setup();
    await user.clear(t2);
    await user.type(t2, 'fitting:1-, fitting:2-');
    await user.clear(t3);
    await user.type(t3, 'fitting:2+, fitting:3+');
    await waitFor(() => expect(document.body.textContent).toContain('Not safe to power up'));
    const beside = screen.getByTestId(`aswired-${CIRCUIT}-b1-t2-problems`);
    expect(beside.textContent).toContain('Block 1 terminal 2: fitting 2 (Porch) − lands here, where fitting 2 (Porch) + belongs');
    expect(t2.getAttribute('aria-invalid')).toBe('true');

    await user.click(screen.getByRole('button', { name: 'Save what was wired' }));
    await screen.findByText('Saved. The check says it is not safe yet.');
    expect(sent).toHaveLength(1);
    expect(sent[0]!.method).toBe('PUT');
    expect(sent[0]!.url).toContain(`/api/jobs/${JOB}/circuits/${CIRCUIT}/as-wired`);
    const body = sent[0]!.body as { version: number | null; blocks: { terminals: { conductors: string[] }[] }[] };
    expect(body.version).toBeNull();
    expect(body.blocks[0]!.terminals[1]!.conductors).toEqual(['fitting:1-', 'fitting:2-']);
  }, 20_000);
});

describe('CommissioningForm', () => {
  it('flags a reading outside the range as it is typed and saves the numbers', async () => {
    const { sent } = stubFetch(() =>
      json(200, { commissioning: { ...circuit.commissioning, version: 1, flagged: 1, updatedAt: '2026-12-01T10:00:00.000Z' } }),
    );
    renderWithApp(<CommissioningForm jobId={JOB} circuit={circuit} />);
    const user = userEvent.setup();
    const far = screen.getByLabelText(/Voltage across the last fitting/);
    const status = () => screen.getByTestId(`commissioning-${CIRCUIT}-far-fitting-voltage-status`).textContent;
    await user.type(far, '2.1');
    await waitFor(() => expect(status()).toBe('Low: outside 2.79–3.41 V'));
    await user.clear(far);
    await user.type(far, '3.0');
    await waitFor(() => expect(status()).toBe('In range'));
    await user.click(screen.getByLabelText('Polarity checked'));
    await user.click(screen.getByRole('button', { name: 'Save readings' }));
    await screen.findByText('Readings saved, 1 flagged.');
    expect(sent[0]!.body).toEqual({
      version: null,
      readings: { 'far-fitting-voltage': 3 },
      checks: { 'polarity-checked': true },
      note: '',
    });
  }, 20_000);
});
