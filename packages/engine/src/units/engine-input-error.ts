import { finding, type Finding } from '../findings';

/**
 * Thrown by the engine's low-level helpers (cable resistance, length conversion) when an
 * input cannot be computed at all. It carries a ready-made finding, so callers that collect
 * findings (series string checks, driver choice) turn it into an error finding instead of
 * crashing.
 */
export class EngineInputError extends Error {
  readonly finding: Finding;

  constructor(code: string, message: string, extra: Pick<Finding, 'subject' | 'values'> = {}) {
    super(message);
    this.name = 'EngineInputError';
    this.finding = finding(code, 'error', message, extra);
  }
}

export function isEngineInputError(e: unknown): e is EngineInputError {
  return e instanceof EngineInputError;
}
