import { describe, expect, it } from 'vitest';
import { codeProfile, elvErrorLimitV, elvLimitsExceeded, UK_IEC_PROFILE, US_NEC_PROFILE } from '../src/profiles';

describe('code profiles', () => {
  it('UK/IEC carries the SELV and outdoor exposed-part limits', () => {
    const selv = UK_IEC_PROFILE.elvLimits.find((l) => l.code === 'above-selv-limit')!;
    // IEC 61140 / IEC 61558-1 3.7.16: SELV at most 50 V AC or 120 V ripple-free DC
    expect([selv.acMaxV, selv.dcMaxV, selv.severity]).toEqual([50, 120, 'error']);
    const outdoor = UK_IEC_PROFILE.elvLimits.find((l) => l.code === 'above-exposed-selv-outdoor-limit')!;
    // IEC 60598-1 8.2.3, other than ordinary conditions; BS 7671 414.4.5: 12 V AC / 30 V DC
    expect([outdoor.acMaxV, outdoor.dcMaxV]).toEqual([12, 30]);
    // BS 7671 Appendix 4: 70 °C conductor for drop work; Section 715 5 % (from memory)
    expect(UK_IEC_PROFILE.dropWorkingTemperatureC).toBe(70);
    expect(UK_IEC_PROFILE.voltageDropLimitPct).toBe(5);
  });

  it('US/NEC carries Article 411 and wet-contact limits', () => {
    // NEC 411: 30 V AC / 60 V DC (60 V DC from memory); wet contact 15 V AC / 30 V DC
    expect(US_NEC_PROFILE.elvLimits.map((l) => [l.acMaxV, l.dcMaxV])).toEqual([
      [30, 60],
      [15, 30],
    ]);
    // NEC 210.19(A) informational note: 3 % branch; NEC Chapter 9 Table 8 at 75 °C
    expect(US_NEC_PROFILE.voltageDropLimitPct).toBe(3);
    expect(US_NEC_PROFILE.dropWorkingTemperatureC).toBe(75);
  });

  it('reports which limits a voltage exceeds', () => {
    // IEC 60598-1 8.2.3 outdoor 30 V DC; IEC 61140 120 V DC
    expect(elvLimitsExceeded(codeProfile('uk-iec'), 29.9)).toEqual([]);
    expect(elvLimitsExceeded(codeProfile('uk-iec'), 48).map((l) => l.code)).toEqual(['above-exposed-selv-outdoor-limit']);
    expect(elvLimitsExceeded(codeProfile('uk-iec'), 121).map((l) => l.code)).toEqual([
      'above-selv-limit',
      'above-exposed-selv-outdoor-limit',
    ]);
    expect(elvErrorLimitV(codeProfile('us-nec'))).toBe(60);
  });
});
