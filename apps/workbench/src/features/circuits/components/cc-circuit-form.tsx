import {
  CABLE_METHOD_LABELS,
  CABLE_METHODS,
  INSTALLATION_LOCATION_LABELS,
  INSTALLATION_LOCATIONS,
  type CableMethod,
  type CableRunDesign,
  type CcCircuitDesign,
  type InstallationLocation,
  type Product,
} from '@gloaming/contracts';
import type { CircuitEvaluation, CircuitFinding } from '@gloaming/engine';
import { useEffect, useRef, type KeyboardEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import type { ChoiceKind } from '../api/catalogue-choices';
import {
  addFitting,
  assignFittingToBlock,
  defaultDriveCurrentA,
  fitLinks,
  fittingBlocks,
  letEngineAssign,
  moveFitting,
  removeFitting,
  updateFitting,
} from '../design-edits';
import { FindingList, findingsAbout } from './finding-list';
import { ProductSelect, fmt } from './product-select';
import { SortableRows, useSortableRow } from './sortable-rows';

const LOCATION_OPTIONS = INSTALLATION_LOCATIONS.map((l) => ({ value: l, label: INSTALLATION_LOCATION_LABELS[l] }));
const METHOD_OPTIONS = CABLE_METHODS.map((m) => ({ value: m, label: CABLE_METHOD_LABELS[m] }));

function CableRunRow({
  label,
  run,
  cables,
  onChange,
  findings,
  onAcknowledge,
  onRemove,
}: {
  label: string;
  run: CableRunDesign;
  cables: readonly Product[];
  onChange: (run: CableRunDesign) => void;
  findings: CircuitFinding[];
  onAcknowledge: (f: CircuitFinding) => void;
  onRemove?: () => void;
}) {
  return (
    <div className="flex flex-col gap-1.5" role="group" aria-label={label}>
      <div className="grid grid-cols-[2fr_1fr_1.3fr_auto] items-end gap-2">
        <ProductSelect
          label={`${label}: cable`}
          products={cables}
          value={run.cableProductId}
          onChange={(id) => onChange({ ...run, cableProductId: id })}
        />
        <TextField
          label={`${label}: length (m)`}
          type="number"
          min={0}
          step={0.1}
          value={String(run.lengthM)}
          onChange={(e) => onChange({ ...run, lengthM: Math.max(0, Number(e.target.value) || 0) })}
        />
        <SelectField
          label={`${label}: laid`}
          options={METHOD_OPTIONS}
          value={run.method}
          onChange={(e) => onChange({ ...run, method: e.target.value as CableMethod })}
        />
        {onRemove ? (
          <Button variant="quiet" className="h-11 px-3" onClick={onRemove} aria-label={`Remove ${label}`}>
            Remove
          </Button>
        ) : (
          <span />
        )}
      </div>
      <FindingList findings={findings} onAcknowledge={onAcknowledge} label={`Findings about the ${label}`} />
    </div>
  );
}

/** The constant-current string: driver, fittings in wiring order, cable runs and block type. */
export function CcCircuitForm({
  design,
  onChange,
  choices,
  evaluation,
  onAcknowledge,
  suggestions,
}: {
  design: CcCircuitDesign;
  onChange: (design: CcCircuitDesign) => void;
  choices: Record<ChoiceKind, Product[]>;
  evaluation: CircuitEvaluation;
  onAcknowledge: (f: CircuitFinding) => void;
  suggestions: React.ReactNode;
}) {
  const products = new Map(
    Object.values(choices)
      .flat()
      .map((p) => [p.id, p]),
  );
  // After a move the row is re-rendered in its new place: put the focus back on the same control.
  const focusAfterMove = useRef<{ id: string; col: string } | null>(null);
  const tableRef = useRef<HTMLTableSectionElement>(null);
  useEffect(() => {
    const pending = focusAfterMove.current;
    if (!pending) return;
    focusAfterMove.current = null;
    tableRef.current?.querySelector<HTMLElement>(`[data-fitting-row="${pending.id}"] [data-col="${pending.col}"]`)?.focus();
  });

  const move = (index: number, by: number, col: string) => {
    const id = design.fittings[index]?.id;
    onChange(moveFitting(design, index, by));
    if (id) focusAfterMove.current = { id, col };
  };
  const onRowKey = (index: number) => (e: KeyboardEvent<HTMLTableRowElement>) => {
    if (!e.altKey || (e.key !== 'ArrowUp' && e.key !== 'ArrowDown')) return;
    e.preventDefault();
    const col =
      (e.target as HTMLElement).closest('[data-col]')?.getAttribute('data-col') ??
      (e.target as HTMLElement).getAttribute('data-col') ??
      'product';
    move(index, e.key === 'ArrowUp' ? -1 : 1, col);
  };
  const blockCount = evaluation.blocks?.blocks.length ?? 0;
  const driverFindings = findingsAbout(evaluation.findings, 'driver');
  const blocks = fittingBlocks(design, evaluation.blocks?.blocks ?? null);
  // a block may be picked up to one past the last in use (a new block)
  const blockChoices = Math.max(blockCount, ...blocks.map((b) => b ?? 0)) + 1;
  const blockOptionsFor = (i: number) => [
    {
      value: 'auto',
      label: design.assignment !== null ? 'Auto (all)' : blocks[i] ? `Auto: ${blocks[i]}` : 'Auto',
    },
    ...Array.from({ length: blockChoices }, (_, k) => ({ value: String(k + 1), label: `Block ${k + 1}` })),
  ];

  const ids = design.fittings.map((f) => f.id);

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="driver-heading" className="flex flex-col gap-2" data-section="driver">
        <h3 id="driver-heading" className="text-lead font-semibold text-ink">
          Driver
        </h3>
        <div className="grid grid-cols-[2fr_1fr] items-end gap-2">
          <ProductSelect
            label="Driver"
            products={choices.driver}
            value={design.driverProductId}
            onChange={(id) => onChange({ ...design, driverProductId: id })}
          />
          <SelectField
            label="Driver location"
            options={LOCATION_OPTIONS}
            value={design.driverLocation}
            onChange={(e) => onChange({ ...design, driverLocation: e.target.value as InstallationLocation })}
          />
        </div>
        <FindingList findings={driverFindings} onAcknowledge={onAcknowledge} label="Findings about the driver" />
        {suggestions}
      </section>

      <section aria-labelledby="fittings-heading" className="flex flex-col gap-2">
        <div className="flex items-center justify-between">
          <h3 id="fittings-heading" className="text-lead font-semibold text-ink">
            Fittings in wiring order
          </h3>
          <p className="text-caption text-ink-muted">
            Drag a fitting by its ⠿ handle, or Alt+↑ / Alt+↓ moves the fitting you are on.
          </p>
        </div>
        <table className="w-full table-fixed text-caption [&_td_label]:sr-only">
          <colgroup>
            <col className="w-12" />
            <col className="w-[27%]" />
            <col className="w-[14%]" />
            <col className="w-[16%]" />
            <col className="w-20" />
            <col className="w-28" />
            <col className="w-16" />
            <col className="w-28" />
          </colgroup>
          <thead>
            <tr className="text-left text-ink-muted">
              <th scope="col" className="w-8 py-1">
                #
              </th>
              <th scope="col" className="py-1">
                Fitting
              </th>
              <th scope="col" className="py-1">
                Label
              </th>
              <th scope="col" className="py-1">
                Location
              </th>
              <th scope="col" className="w-28 py-1">
                Drive mA
              </th>
              <th scope="col" className="py-1">
                Block
              </th>
              <th scope="col" className="py-1">
                Vf
              </th>
              <th scope="col" className="py-1">
                <span className="sr-only">Order</span>
              </th>
            </tr>
          </thead>
          <SortableRows ids={ids} what="fitting" onMove={(from, to) => onChange(moveFitting(design, from, to - from))}>
            <tbody ref={tableRef}>
              {design.fittings.map((f, i) => {
                const at = evaluation.series?.fittings[i];
                const rowFindings = findingsAbout(evaluation.findings, `fitting:${i + 1}`);
                return (
                  <FittingRows
                    key={f.id}
                    index={i}
                    count={design.fittings.length}
                    onKeyDown={onRowKey(i)}
                    rowId={f.id}
                    findings={rowFindings}
                    onAcknowledge={onAcknowledge}
                  >
                    <td className="py-1 pr-2">
                      <ProductSelect
                        label={`Fitting ${i + 1} product`}
                        products={choices.fitting}
                        value={f.productId}
                        dataCol="product"
                        onChange={(id) =>
                          id &&
                          onChange(
                            updateFitting(design, i, { productId: id, driveCurrentA: defaultDriveCurrentA(products.get(id)) }),
                          )
                        }
                      />
                    </td>
                    <td className="py-1 pr-2">
                      <TextField
                        label={`Fitting ${i + 1} label`}
                        value={f.label}
                        data-col="label"
                        onChange={(e) => onChange(updateFitting(design, i, { label: e.target.value }))}
                      />
                    </td>
                    <td className="py-1 pr-2">
                      <SelectField
                        label={`Fitting ${i + 1} location`}
                        options={LOCATION_OPTIONS}
                        value={f.location}
                        data-col="location"
                        onChange={(e) => onChange(updateFitting(design, i, { location: e.target.value as InstallationLocation }))}
                      />
                    </td>
                    <td className="py-1 pr-2">
                      <TextField
                        label={`Fitting ${i + 1} drive current (mA)`}
                        type="number"
                        min={1}
                        step={1}
                        data-col="current"
                        value={String(Math.round(f.driveCurrentA * 1000))}
                        onChange={(e) => {
                          const mA = Number(e.target.value);
                          if (Number.isFinite(mA) && mA > 0) onChange(updateFitting(design, i, { driveCurrentA: mA / 1000 }));
                        }}
                      />
                    </td>
                    <td className="py-1 pr-2">
                      <SelectField
                        label={`Fitting ${i + 1} connector block`}
                        options={blockOptionsFor(i)}
                        value={design.assignment === null || blocks[i] === null ? 'auto' : String(blocks[i])}
                        data-col="block"
                        disabled={!evaluation.blocks && design.assignment === null}
                        onChange={(e) =>
                          onChange(
                            e.target.value === 'auto'
                              ? letEngineAssign(design)
                              : assignFittingToBlock(design, blocks, i, Number(e.target.value)),
                          )
                        }
                      />
                    </td>
                    <td className="py-1 pr-2 font-mono">{at ? `${fmt(at.forwardVoltageV)} V` : '—'}</td>
                    <td className="py-1 whitespace-nowrap">
                      <Button
                        variant="quiet"
                        className="h-9 px-2"
                        aria-label={`Move fitting ${i + 1} up`}
                        disabled={i === 0}
                        onClick={() => move(i, -1, 'up')}
                        data-col="up"
                      >
                        ↑
                      </Button>
                      <Button
                        variant="quiet"
                        className="h-9 px-2"
                        aria-label={`Move fitting ${i + 1} down`}
                        disabled={i === design.fittings.length - 1}
                        onClick={() => move(i, 1, 'down')}
                        data-col="down"
                      >
                        ↓
                      </Button>
                      <Button
                        variant="quiet"
                        className="h-9 px-2"
                        aria-label={`Remove fitting ${i + 1}`}
                        onClick={() => onChange(removeFitting(design, i))}
                      >
                        ✕
                      </Button>
                    </td>
                  </FittingRows>
                );
              })}
            </tbody>
          </SortableRows>
        </table>
        {design.assignment !== null ? (
          <p className="flex items-center gap-3 text-caption text-ink-muted">
            You placed the fittings in blocks yourself; moving, adding or removing a fitting hands them back to the engine.
            <Button variant="secondary" className="h-8 px-3" onClick={() => onChange(letEngineAssign(design))}>
              Let the engine assign every fitting
            </Button>
          </p>
        ) : null}
        <div>
          <Button
            variant="secondary"
            className="h-9"
            disabled={choices.fitting.length === 0}
            onClick={() => onChange(addFitting(design, design.fittings.length === 0 ? choices.fitting[0] : undefined))}
          >
            Add fitting
          </Button>
          {choices.fitting.length === 0 ? (
            <span className="ml-2 text-caption text-ink-muted">Add light fittings to the catalogue first.</span>
          ) : null}
        </div>
      </section>

      <section aria-labelledby="cables-heading" className="flex flex-col gap-3">
        <h3 id="cables-heading" className="text-lead font-semibold text-ink">
          Cable runs and connector blocks
        </h3>
        {design.driverLead ? (
          <CableRunRow
            label="Driver lead"
            run={design.driverLead}
            cables={choices.cable}
            onChange={(run) => onChange({ ...design, driverLead: run })}
            findings={findingsAbout(evaluation.findings, 'cable:lead')}
            onAcknowledge={onAcknowledge}
            onRemove={() => onChange({ ...design, driverLead: null })}
          />
        ) : (
          <div>
            <Button
              variant="secondary"
              className="h-9"
              onClick={() =>
                onChange({
                  ...design,
                  driverLead: { cableProductId: choices.cable[0]?.id ?? null, lengthM: 5, method: 'buried-trench' },
                })
              }
            >
              Add driver lead
            </Button>
          </div>
        )}
        <ProductSelect
          label="Connector block type"
          products={choices['connector-block']}
          value={design.connectorBlockProductId}
          onChange={(id) => onChange({ ...design, connectorBlockProductId: id })}
        />
        <FindingList
          findings={findingsAbout(evaluation.findings, 'blocks')}
          onAcknowledge={onAcknowledge}
          label="Findings about the blocks"
        />
        {design.links.map((l, k) => (
          <CableRunRow
            key={k}
            label={`Link ${k + 1} (block ${k + 1} to ${k + 2})`}
            run={l}
            cables={choices.cable}
            onChange={(run) => onChange({ ...design, links: design.links.map((x, j) => (j === k ? run : x)) })}
            findings={findingsAbout(evaluation.findings, `cable:link-${k + 1}`)}
            onAcknowledge={onAcknowledge}
            onRemove={() => onChange({ ...design, links: design.links.filter((_, j) => j !== k) })}
          />
        ))}
        {blockCount > 0 && design.links.length !== blockCount - 1 ? (
          <p className="flex items-center gap-3 text-caption text-lamp-800">
            The plan uses {blockCount} block{blockCount === 1 ? '' : 's'}, so {blockCount - 1} link cable
            {blockCount - 1 === 1 ? '' : 's'}; {design.links.length} entered.
            <Button variant="secondary" className="h-8 px-3" onClick={() => onChange(fitLinks(design, blockCount))}>
              Match links to blocks
            </Button>
          </p>
        ) : null}
        {design.extensions.map((x, k) => (
          <CableRunRow
            key={`x${k}`}
            label={`Extension ${k + 1}`}
            run={x}
            cables={choices.cable}
            onChange={(run) =>
              onChange({ ...design, extensions: design.extensions.map((e, j) => (j === k ? { ...e, ...run } : e)) })
            }
            findings={findingsAbout(evaluation.findings, `cable:extension-${k + 1}`)}
            onAcknowledge={onAcknowledge}
            onRemove={() => onChange({ ...design, extensions: design.extensions.filter((_, j) => j !== k) })}
          />
        ))}
        <div className="flex gap-2">
          <Button
            variant="secondary"
            className="h-9"
            onClick={() =>
              onChange({
                ...design,
                links: [
                  ...design.links,
                  { cableProductId: design.driverLead?.cableProductId ?? null, lengthM: 5, method: 'buried-trench' },
                ],
              })
            }
          >
            Add link cable
          </Button>
          <Button
            variant="secondary"
            className="h-9"
            onClick={() =>
              onChange({
                ...design,
                extensions: [
                  ...design.extensions,
                  { cableProductId: design.driverLead?.cableProductId ?? null, lengthM: 2, method: 'buried-trench', label: '' },
                ],
              })
            }
          >
            Add extension
          </Button>
        </div>
      </section>
    </div>
  );
}

function FittingRows({
  children,
  index,
  rowId,
  count,
  findings,
  onAcknowledge,
  onKeyDown,
}: {
  children: React.ReactNode;
  index: number;
  rowId: string;
  count: number;
  findings: CircuitFinding[];
  onAcknowledge: (f: CircuitFinding) => void;
  onKeyDown: (e: KeyboardEvent<HTMLTableRowElement>) => void;
}) {
  const { row, handle, isDragging } = useSortableRow(rowId, `fitting ${index + 1}`, index);
  return (
    <>
      <tr
        {...row}
        data-fitting-row={rowId}
        onKeyDown={onKeyDown}
        aria-label={`Fitting ${index + 1} of ${count}`}
        className={`border-t border-line align-bottom ${isDragging ? 'relative z-10 bg-lamp-50 shadow-raised' : ''}`}
      >
        <td className="py-1 pr-1 font-mono text-ink-muted">{handle}</td>
        {children}
      </tr>
      {findings.length > 0 ? (
        <tr data-fitting-findings={rowId}>
          <td />
          <td colSpan={7} className="pb-2">
            <FindingList findings={findings} onAcknowledge={onAcknowledge} label={`Findings about fitting ${index + 1}`} />
          </td>
        </tr>
      ) : null}
    </>
  );
}
