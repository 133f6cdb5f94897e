import type { CircuitEvaluation, CircuitFinding } from '@gloaming/engine';
import { FindingList } from './finding-list';
import { fmt } from './product-select';

function Figure({ label, value, unit, testId }: { label: string; value: string; unit: string; testId: string }) {
  return (
    <div className="flex flex-col rounded-control bg-mist-50 px-3 py-2 ring-1 ring-line">
      <dt className="text-micro text-ink-muted">{label}</dt>
      <dd className="font-mono text-body text-ink" data-figure={testId}>
        {value} <span className="text-caption text-ink-muted">{unit}</span>
      </dd>
    </div>
  );
}

/** The numbers of the live check, and the findings that belong to no single fitting, cable or driver. */
export function CircuitResults({
  evaluation,
  general,
  onAcknowledge,
}: {
  evaluation: CircuitEvaluation;
  general: CircuitFinding[];
  onAcknowledge: (f: CircuitFinding) => void;
}) {
  const s = evaluation.series;
  const p = evaluation.preview;
  const cv = evaluation.cv;
  return (
    <section aria-label="Live results" className="flex flex-col gap-3">
      <div className="flex items-center justify-between">
        <h3 className="text-lead font-semibold text-ink">Live results</h3>
        <p role="status" aria-live="polite" className="text-caption font-semibold">
          {evaluation.ok ? (
            <span className="text-leaf-700">✓ No blocking errors</span>
          ) : (
            <span className="text-ember-700">
              ✕ {evaluation.blockingCount} error{evaluation.blockingCount === 1 ? '' : 's'} to resolve or accept
            </span>
          )}
        </p>
      </div>
      {s ? (
        <dl className="grid grid-cols-3 gap-2 lg:grid-cols-5">
          <Figure label="String voltage (sum of Vf)" value={fmt(s.stringForwardVoltageV)} unit="V" testId="string-voltage" />
          <Figure label="Cable drop" value={fmt(s.cableDropV, 3)} unit="V" testId="cable-drop" />
          <Figure label="Driver must reach" value={fmt(s.complianceVoltageV)} unit="V" testId="compliance-voltage" />
          <Figure label="Output power" value={fmt(s.outputPowerW)} unit="W" testId="output-power" />
          <Figure label="Driver loading" value={fmt(s.loadingPct, 1)} unit="%" testId="loading" />
          <Figure label="Headroom" value={fmt(s.headroomPct, 1)} unit="%" testId="headroom" />
          <Figure label="Mains input" value={fmt(s.inputPowerW)} unit="W" testId="input-power" />
          <Figure label="Light" value={fmt(s.lumens, 0)} unit="lm" testId="lumens" />
          <Figure label="Most fittings in margin" value={fmt(s.maxFittingsWithinMargin, 0)} unit="" testId="max-fittings" />
        </dl>
      ) : p ? (
        <>
          <p className="text-caption text-ink-muted">No driver chosen yet: the string at {fmt(p.currentA * 1000, 0)} mA.</p>
          <dl className="grid grid-cols-3 gap-2 lg:grid-cols-5">
            <Figure label="String voltage (sum of Vf)" value={fmt(p.stringForwardVoltageV)} unit="V" testId="string-voltage" />
            <Figure label="Cable drop" value={fmt(p.cableDropV, 3)} unit="V" testId="cable-drop" />
            <Figure label="Driver must reach" value={fmt(p.complianceVoltageV)} unit="V" testId="compliance-voltage" />
            <Figure label="Output power" value={fmt(p.outputPowerW)} unit="W" testId="output-power" />
          </dl>
        </>
      ) : null}
      {cv ? (
        <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
          <Figure label="Supply" value={fmt(cv.nominalVoltageV)} unit="V" testId="supply-voltage" />
          <Figure label="Load" value={fmt(cv.loadW)} unit="W" testId="load" />
          <Figure
            label="Supply loading"
            value={fmt(cv.loadingPct, 1)}
            unit={`% (limit ${fmt(cv.loadingLimitPct, 0)} %)`}
            testId="loading"
          />
          <Figure
            label="Worst fitting"
            value={cv.worst ? `${fmt(cv.worst.voltageV)} V, ${fmt(cv.worst.dropPct, 1)}` : '—'}
            unit="% drop"
            testId="worst"
          />
        </dl>
      ) : null}
      <FindingList findings={general} onAcknowledge={onAcknowledge} label="Findings about the whole circuit" />
    </section>
  );
}
