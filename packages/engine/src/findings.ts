/**
 * Findings: every engine result carries a list of these. A finding has a stable machine
 * code (never reworded once shipped, the front ends and stored results key on it), a
 * severity and a plain-English message written for an estimator, not a programmer.
 */
export type Severity = 'error' | 'warning' | 'info';

export interface Finding {
  /** Stable machine code, kebab-case, e.g. `current-above-rating`. */
  code: string;
  severity: Severity;
  /** One or two sentences an estimator understands. */
  message: string;
  /** Where the problem is: `driver`, `fitting:3`, `cable:lead`, `block:2/terminal:4`... */
  subject?: string;
  /** Numbers behind the message, with units in the key names (e.g. `voltageV`). */
  values?: Record<string, number | string>;
}

export function finding(
  code: string,
  severity: Severity,
  message: string,
  extra: Pick<Finding, 'subject' | 'values'> = {},
): Finding {
  return { code, severity, message, ...extra };
}

export function hasErrors(findings: readonly Finding[]): boolean {
  return findings.some((f) => f.severity === 'error');
}
