/**
 * Bridge from a series string as the string check takes it (fittings with `name` and a
 * `tail` of `Length` + `CableSpec`; cable runs by role) to the block planner's layout.
 * Lengths become metres; a cable's conductor size becomes mm² (AWG by the diameter formula).
 * Sheath diameters are not part of a cable spec, so entry seals are counted unchecked.
 */
import { awgAreaMm2 } from '../cables/awg';
import type { CableSpec } from '../cables/cable-spec';
import type { StringLayout } from '../series/series-types';
import { feetToMetres, type Length } from '../units/length';
import type { BlockCableRef, SeriesStringLayout } from './connector-block';

export function blockLayoutFromSeries(layout: Pick<StringLayout, 'fittings' | 'runs'>): SeriesStringLayout {
  const runs = Array.isArray(layout?.runs) ? layout.runs : [];
  const fittings = Array.isArray(layout?.fittings) ? layout.fittings : [];
  const lead = runs.find((r) => r?.role === 'driver-lead');
  const links = runs.filter((r) => r?.role === 'link');
  const result: SeriesStringLayout = {
    fittings: fittings.map((f, i) => ({
      id: f?.id ?? String(i + 1),
      ...(f?.name ? { label: f.name } : {}),
      ...(f?.tail ? { tail: cableRef(f.tail.length, f.tail.cable) } : {}),
    })),
  };
  if (lead) result.driverLead = cableRef(lead.length, lead.cable);
  if (links.length > 0) {
    result.linkCable = {
      ...cableRef(undefined, links[0]!.cable),
      lengthsM: links.map((l) => lengthM(l.length) ?? Number.NaN),
    };
  }
  return result;
}

function lengthM(length: Length | undefined): number | undefined {
  if (!length || typeof length.value !== 'number') return undefined;
  return length.unit === 'ft' ? feetToMetres(length.value) : length.value;
}

function conductorMm2(cable: CableSpec | undefined): number | undefined {
  if (!cable) return undefined;
  if (cable.kind === 'metric') return cable.areaMm2;
  try {
    return awgAreaMm2(cable.gauge);
  } catch {
    return undefined; // an impossible gauge is the string check's finding, not the block plan's
  }
}

function cableRef(length: Length | undefined, cable: CableSpec | undefined): BlockCableRef {
  const ref: BlockCableRef = {};
  const m = lengthM(length);
  const mm2 = conductorMm2(cable);
  if (m !== undefined) ref.lengthM = m;
  if (mm2 !== undefined) ref.conductorMm2 = mm2;
  return ref;
}
