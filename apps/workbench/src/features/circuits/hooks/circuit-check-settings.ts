import type { CircuitCheckSettings, CodeProfileId } from '@gloaming/contracts';
import { createContext, useContext } from 'react';

/**
 * What the open revision's circuit checks go by (its code profile, driver headroom,
 * voltage-drop limit and IP minimums), exactly as the api checked with it. The circuits page
 * provides the one from the circuit list; the live check reads it.
 */
export const CircuitCheckSettingsContext = createContext<CircuitCheckSettings | null>(null);

/** The revision's check settings; outside a circuits page only the profile is known. */
export function useCircuitCheckSettings(profile: CodeProfileId): CircuitCheckSettings {
  return useContext(CircuitCheckSettingsContext) ?? { profile };
}
