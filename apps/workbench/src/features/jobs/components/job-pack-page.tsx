import type { CodeProfileId, InstallerProduct, JobPackCircuit } from '@gloaming/contracts';
import { useParams } from 'react-router-dom';
import { Card } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { RunDiagram } from '../../circuits/components/run-diagram';
import { StringDiagram } from '../../circuits/components/string-diagram';
import { TerminalSchedule } from '../../circuits/components/terminal-schedule';
import { jobPackPdfUrl, useJobPack } from '../api/get-job-pack';
import { usePackCircuit } from '../hooks/use-pack-circuit';
import { AsWiredEditor } from './as-wired-editor';
import { CommissioningForm } from './commissioning-form';
import { PickList } from './pick-list';

function CircuitPack({
  jobId,
  circuit,
  index,
  products,
  profile,
}: {
  jobId: string;
  circuit: JobPackCircuit;
  index: number;
  products: readonly InstallerProduct[];
  profile: CodeProfileId;
}) {
  const evaluation = usePackCircuit(circuit, products, profile);
  const plan = evaluation.blocks;
  const cv = evaluation.cv;
  const title = `Circuit ${index + 1} · ${circuit.name ? `${circuit.area}: ${circuit.name}` : circuit.area}`;
  return (
    <Card
      title={title}
      description={`${circuit.kind === 'constant-current' ? 'Constant current, series string' : 'Constant voltage, parallel'} · ${
        circuit.powerName || 'no driver chosen'
      }`}
    >
      <div className="flex flex-col gap-6">
        {!circuit.designOk && (
          <p
            role="alert"
            className="rounded-control bg-ember-50 px-4 py-3 text-caption text-ember-700 ring-1 ring-inset ring-ember-600/30"
          >
            The design check of this circuit has errors nobody has resolved. Ask the estimator before fitting it.
          </p>
        )}
        {plan && plan.blocks.length > 0 && (
          <>
            <div className="overflow-x-auto rounded-control bg-canvas p-3 ring-1 ring-line">
              <StringDiagram plan={plan} driverName={circuit.powerName} />
            </div>
            <TerminalSchedule plan={plan} />
            <AsWiredEditor jobId={jobId} circuit={circuit} plan={plan} />
          </>
        )}
        {cv && circuit.design.kind === 'constant-voltage' && (
          <div className="overflow-x-auto rounded-control bg-canvas p-3 ring-1 ring-line">
            <RunDiagram design={circuit.design} cv={cv} supplyName={circuit.powerName || 'no supply chosen'} />
          </div>
        )}
        {cv && (
          <div className="overflow-x-auto">
            <table className="w-full min-w-[28rem] text-caption" aria-label={`Expected voltages, ${circuit.area}`}>
              <caption className="mb-1 text-left text-body font-semibold text-ink">
                Runs at {cv.nominalVoltageV} V: the voltage to expect at each fitting
              </caption>
              <thead>
                <tr className="border-b border-line text-left text-ink-muted">
                  <th scope="col" className="py-1 pr-2 font-semibold">
                    Run
                  </th>
                  <th scope="col" className="py-1 pr-2 font-semibold">
                    Fitting
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right font-semibold">
                    Expect
                  </th>
                  <th scope="col" className="py-1 text-right font-semibold">
                    Drop
                  </th>
                </tr>
              </thead>
              <tbody>
                {cv.runs.flatMap((r) => {
                  const run =
                    circuit.design.kind === 'constant-voltage' ? circuit.design.runs.find((x) => x.id === r.id) : undefined;
                  return r.fittings.map((f, k) => (
                    <tr key={`${r.id}-${k}`} className="border-b border-line/60">
                      <td className="py-1.5 pr-2">{run?.label || r.id}</td>
                      <td className="py-1.5 pr-2">{run?.fittings[k]?.label || `Fitting ${k + 1}`}</td>
                      <td className="py-1.5 pr-2 text-right tabular-nums">{f.voltageV.toFixed(2)} V</td>
                      <td className="py-1.5 text-right tabular-nums">{f.dropPct.toFixed(1)} %</td>
                    </tr>
                  ));
                })}
              </tbody>
            </table>
          </div>
        )}
        <CommissioningForm jobId={jobId} circuit={circuit} />
      </div>
    </Card>
  );
}

/** The installer's pack on a phone: pick list, each circuit's diagram and schedule, as-wired record and readings. No prices. */
export function JobPackPage() {
  const { jobId = '' } = useParams();
  const { data: pack, isError } = useJobPack(jobId);
  if (isError)
    return (
      <p role="alert" className="text-body text-ink">
        This job was not found, or its quote is no longer approved.
      </p>
    );
  if (!pack) return <p className="text-body text-ink-muted">Loading the pack…</p>;
  const { job } = pack;
  return (
    <>
      <title>{`${job.reference} pack · Gloaming`}</title>
      <PageHeader eyebrow={`${job.reference} · revision ${job.revisionNumber}`} title={job.title || job.customerName}>
        Installer’s pack for {job.customerName}
      </PageHeader>
      <div className="flex flex-col gap-6">
        <aside
          aria-label="Electrical caution"
          className="rounded-control bg-lamp-50 px-4 py-3 text-caption text-lamp-800 ring-1 ring-inset ring-lamp-300"
        >
          <p className="font-semibold">Electrical caution</p>
          <p>{pack.caution}</p>
        </aside>
        <div className="grid gap-4 sm:grid-cols-2">
          <div className="rounded-control bg-surface px-4 py-3 ring-1 ring-line">
            <p className="text-micro font-semibold uppercase tracking-wide text-ink-muted">Customer</p>
            <p className="text-body font-semibold text-ink">{job.customerName}</p>
            {job.customerPhone && (
              <a className="text-body text-dusk-700 underline" href={`tel:${job.customerPhone.replace(/\s+/g, '')}`}>
                {job.customerPhone}
              </a>
            )}
          </div>
          <div className="rounded-control bg-surface px-4 py-3 ring-1 ring-line">
            <p className="text-micro font-semibold uppercase tracking-wide text-ink-muted">Site</p>
            {job.siteLabel && <p className="text-body font-semibold text-ink">{job.siteLabel}</p>}
            <address className="text-body not-italic text-ink">
              {[...job.siteAddress, job.postcode].filter(Boolean).join(', ')}
            </address>
            {job.accessNotes && <p className="text-caption text-ink-muted">Access: {job.accessNotes}</p>}
          </div>
        </div>
        <div>
          <a
            href={jobPackPdfUrl(job.id)}
            download
            className="inline-flex h-11 items-center rounded-control bg-surface px-5 text-body font-semibold text-dusk-800 ring-1 ring-inset ring-mist-300 hover:bg-dusk-50"
          >
            Download the pack (PDF)
          </a>
        </div>
        <Card title="Pick list" description="What to load for this job, with the cable cut lengths.">
          <PickList pack={pack} />
        </Card>
        {pack.circuits.length === 0 && <p className="text-body text-ink-muted">No circuits are designed for this job yet.</p>}
        {pack.circuits.map((c, i) => (
          <CircuitPack key={c.id} jobId={job.id} circuit={c} index={i} products={pack.products} profile={pack.profile} />
        ))}
      </div>
    </>
  );
}
