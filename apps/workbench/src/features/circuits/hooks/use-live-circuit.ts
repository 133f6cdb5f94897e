import type { CircuitDesign, CodeProfileId, Product } from '@gloaming/contracts';
import { evaluateCircuit, type CircuitEvaluation } from '@gloaming/engine';
import { useMemo } from 'react';
import { useCircuitCheckSettings } from './circuit-check-settings';

/**
 * The engine's check of the design as it is on screen: the same function the api runs on save,
 * with the same settings (the revision's, from the circuit list).
 */
export function useLiveCircuit(design: CircuitDesign, products: readonly Product[], profile: CodeProfileId): CircuitEvaluation {
  const settings = useCircuitCheckSettings(profile);
  return useMemo(() => evaluateCircuit(design, products, settings), [design, products, settings]);
}

function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) || Array.isArray(b))
    return Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((x, i) => sameJson(x, b[i]));
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return false;
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  return (
    ka.length === kb.length && ka.every((k) => sameJson((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]))
  );
}

/** Whether the check stored on save is the one this page computes (compared as the JSON both sides hold). */
export function agreesWithSaved(live: CircuitEvaluation, saved: unknown): boolean {
  return sameJson(JSON.parse(JSON.stringify(live)), saved);
}
