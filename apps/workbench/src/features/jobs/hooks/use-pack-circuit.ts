import type { CodeProfileId, InstallerProduct, JobPackCircuit } from '@gloaming/contracts';
import { evaluateCircuit, type CircuitEvaluation, type DesignProduct } from '@gloaming/engine';
import { useMemo } from 'react';

/**
 * The pack's products as the engine reads them. Prices never reach the installer; the checks
 * do not use them, so they are zero here.
 */
export function designProducts(products: readonly InstallerProduct[]): DesignProduct[] {
  return products.map((p) => ({ ...p, costMinor: 0, listPriceMinor: 0 }));
}

/** The approved circuit checked in the browser with the engine the api uses: its block plan draws the diagram and schedule. */
export function usePackCircuit(
  circuit: JobPackCircuit,
  products: readonly InstallerProduct[],
  profile: CodeProfileId,
): CircuitEvaluation {
  return useMemo(
    () => evaluateCircuit(circuit.design, designProducts(products), { profile }),
    [circuit.design, products, profile],
  );
}
