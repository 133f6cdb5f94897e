import type { Product } from '@gloaming/contracts';

const n = (v: number) => new Intl.NumberFormat('en-GB', { maximumFractionDigits: 3 }).format(v);

/** One line of the electrical facts for the table, in the trade's shorthand. */
export function specSummary(product: Product): string {
  switch (product.kind) {
    case 'fitting': {
      const s = product.spec;
      const drive =
        s.driveMode === 'constant-voltage'
          ? `${n(s.nominalVoltageV)} V CV, ${n(s.powerW)} W`
          : s.ratings.map((r) => `${n(r.currentA * 1000)} mA${r.powerW ? ` ${n(r.powerW)} W` : ''}${r.forwardVoltageV ? ` ${n(r.forwardVoltageV)} V` : ''}`).join(' / ');
      return [drive, s.ipCode, s.beamAngleDeg ? `${n(s.beamAngleDeg)}°` : '', s.colourTemperatureK ? `${s.colourTemperatureK} K` : ''].filter(Boolean).join(' · ');
    }
    case 'driver': {
      const s = product.spec;
      return `${n(s.currentA * 1000)} mA · ${n(s.voltageWindowV.minV)}–${n(s.voltageWindowV.maxV)} V · ${n(s.maxPowerW)} W max · ${s.ipCode}`;
    }
    case 'cv-supply':
      return `${n(product.spec.outputVoltageV)} V · ${n(product.spec.ratedPowerW)} W · ${product.spec.ipCode}`;
    case 'cable': {
      const c = product.spec.conductor;
      const size = c.kind === 'metric' ? `${n(c.areaMm2)} mm² class ${c.conductorClass}` : `${c.gauge} AWG`;
      return `${product.spec.cores}-core ${size}${product.spec.cutLengthM ? ` · ${n(product.spec.cutLengthM)} m` : ''}`;
    }
    case 'connector-block':
      return `${product.spec.terminals} terminals · ${product.spec.entries} entries · ${product.spec.ipCode}`;
    case 'labour':
      return `${product.spec.minutes} min`;
    case 'accessory':
      return product.description;
  }
}
