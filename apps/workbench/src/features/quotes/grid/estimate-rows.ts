/**
 * The grid shows an estimate as one flat list: a header row per section (an area of the
 * garden) followed by its lines. This maps between that list and the document.
 */
import type { EstimateContent, EstimateLine, EstimateSection } from '@gloaming/contracts';

export type GridRow =
  | { kind: 'section'; key: string; sectionIndex: number; section: EstimateSection }
  | { kind: 'line'; key: string; sectionIndex: number; lineIndex: number; line: EstimateLine };

export type LineRow = Extract<GridRow, { kind: 'line' }>;

export function flattenEstimate(content: EstimateContent): GridRow[] {
  const rows: GridRow[] = [];
  content.sections.forEach((section, sectionIndex) => {
    rows.push({ kind: 'section', key: `s:${section.id}`, sectionIndex, section });
    section.lines.forEach((line, lineIndex) => rows.push({ kind: 'line', key: `l:${line.id}`, sectionIndex, lineIndex, line }));
  });
  return rows;
}

/** A line is derived from a circuit (read-only in the grid) unless the estimator overrode it. */
export const isDerivedLine = (line: EstimateLine): boolean => line.circuitId !== null && !line.overridden;
