/**
 * @gloaming/engine public API. Pure TypeScript: no I/O, no framework, deterministic,
 * JSON-serialisable inputs and outputs. Each module is re-exported here.
 */
export * from './findings';
// -- cables, units, IP code, code profiles, series strings, driver choice (section A)
export * from './units';
export * from './cables';
export * from './ip-code';
export * from './profiles';
export * from './series';
export * from './drivers';
// -- connector blocks, terminal schedule, wiring check (section B)
export {
  blockNeeds,
  blockPosition,
  type BlockCableRef,
  type BlockPosition,
  type ConnectorBlockType,
  type SeriesStringLayout,
  type StringFittingRef,
} from './blocks/connector-block';
export {
  planConnectorBlocks,
  type BlockPlan,
  type BlockPlanInput,
  type PlannedBlock,
  type PlannedLink,
  type PlannedTerminal,
} from './blocks/block-plan';
export { type BlockEntries, type EntryFit, type EntryUse } from './blocks/entry-seals';
export { type InstallerStep } from './blocks/installer-steps';
export { blockLayoutFromSeries } from './blocks/from-series-layout';
export {
  describeConductorEnd,
  formatConductorEnd,
  parseConductorEnd,
  type ConductorEnd,
  type EndPolarity,
} from './wiring/conductor-id';
export {
  type ScheduleBlock,
  type ScheduleTerminal,
  type TerminalSchedule,
  type WiringKind,
} from './wiring/terminal-schedule';
export { checkWiring, electricalNodes, type WiringCheckResult, type WiringNode } from './wiring/wiring-check';
export * from './wiring/wiring-advice';
// -- constant-voltage runs, takeoff, labour, money (section C)
export * from './money';
export * from './takeoff';
export * from './labour';
export * from './cv';
// -- a designed circuit (placements and catalogue products) mapped to the checks above
export * from './circuit-design';
// -- commissioning readings on site, against what the evaluation expects
export * from './commissioning';
// -- the installer's pick list (no prices)
export * from './installer-pack';
