import { describe, expect, it } from 'vitest';
import {
  checkIpForLocation,
  DEFAULT_MINIMUM_IP,
  minimumIpFor,
  parseIpCode,
  satisfies,
  type IpCode,
} from '../src/ip-code';

function parsed(text: string): IpCode {
  const r = parseIpCode(text);
  if (!r.ok) throw new Error(`expected ${text} to parse`);
  return r.code;
}

describe('parseIpCode (IEC 60529 clause 4)', () => {
  it.each([
    // [input, canonical, first numeral, second numeral]
    ['IP65', 'IP65', 6, 5],
    ['ipx7', 'IPX7', null, 7],
    [' IP6X ', 'IP6X', 6, null],
    ['IP20', 'IP20', 2, 0],
    ['IP68', 'IP68', 6, 8],
    ['IPX9', 'IPX9', null, 9], // IEC 60529 Amd 2:2013 numeral 9
  ])('%s', (text, canonical, solids, water) => {
    const c = parsed(text);
    expect(c.text).toBe(canonical);
    expect(c.ratings).toHaveLength(1);
    expect(c.ratings[0]!.solids).toBe(solids);
    expect(c.ratings[0]!.water).toBe(water);
  });

  it('reads dual codes, with or without the second "IP"', () => {
    // IEC 60529 clause 6: an enclosure for both jets and immersion is dual-coded, e.g. IP66/IP68
    expect(parsed('IP66/IP68').ratings.map((r) => r.water)).toEqual([6, 8]);
    expect(parsed('IP66/68').text).toBe('IP66/IP68');
    expect(parsed('IP67/IP69K').ratings[1]!.water9K).toBe(true);
  });

  it('reads 9K and the additional and supplementary letters', () => {
    // ISO 20653: 9K; IEC 60529 clause 4: additional letter A-D, supplementary letters H M S W
    const k = parsed('IPX9K');
    expect(k.ratings[0]!.water).toBe(9);
    expect(k.ratings[0]!.water9K).toBe(true);
    const lettered = parsed('IP20C');
    expect(lettered.ratings[0]!.access).toBe('C');
    const supp = parsed('IP65DW');
    expect(supp.ratings[0]!.access).toBe('D');
    expect(supp.ratings[0]!.supplementary).toEqual(['W']);
    expect(parsed('IPXXB').ratings[0]!.access).toBe('B');
    expect(parsed('IP54M').ratings[0]!.supplementary).toEqual(['M']);
  });

  it.each([
    ['IP7', /two numerals/],
    ['IP75', /first numeral/],
    ['IP6', /two numerals/],
    ['65', /start with "IP"/],
    ['IP65E', /letter/],
    ['IP65DA', /letter/],
    ['IPX7K', /9K/],
    ['IP66/', /empty/],
    ['IP54MS', /cannot both/],
    ['IP65WW', /repeated/],
    ['', /empty/],
  ])('rejects %s with a clear finding', (text, why) => {
    const r = parseIpCode(text, 'fitting:1');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.findings[0]!.code).toBe('ip-code-malformed');
    expect(r.findings[0]!.severity).toBe('error');
    expect(r.findings[0]!.subject).toBe('fitting:1');
    expect(r.findings[0]!.message).toMatch(why);
  });

  it('never throws on junk', () => {
    expect(parseIpCode(null).ok).toBe(false);
    expect(parseIpCode(42).ok).toBe(false);
  });
});

describe('satisfies (IEC 60529 clause 6)', () => {
  it.each([
    // [product, requirement, expected, source]
    ['IP65', 'IPX4', true], // numerals up to 6 are cumulative
    ['IP66', 'IP65', true],
    ['IP65', 'IP66', false],
    ['IP44', 'IP65', false],
    ['IP67', 'IP65', false], // 7 does not imply 5 unless dual-coded
    ['IP68', 'IP66', false], // 8 does not imply 6 unless dual-coded
    ['IP66/IP68', 'IP65', true], // dual-coded: the jets part covers it
    ['IP66/IP68', 'IP67', true], // and the immersion part covers 7 (8 is more severe than 7)
    ['IP68', 'IP67', true],
    ['IP67', 'IP68', false],
    ['IPX9', 'IPX6', false], // 9 does not imply 5/6 (Amd 2:2013)
    ['IPX9', 'IPX7', false], // nor 7/8
    ['IPX9K', 'IPX9', true], // ISO 20653 9K meets a 9 requirement
    ['IPX9', 'IPX9K', false],
    ['IPX7', 'IP65', false], // X offers nothing for solids
    ['IP6X', 'IP6X', true],
    ['IP6X', 'IPX4', false],
    ['IP67', 'IPX4', true], // 7 taken to cover 1-4 [memory]
    ['IP68', 'IP66/IP68', false], // a dual requirement needs both parts
    ['IP66/IP68', 'IP66/IP68', true],
    ['IP20', 'IPXXB', true], // first numeral 2 implies finger protection B (IEC 60529 Table 7)
    ['IP20', 'IPXXC', false],
    ['IP20C', 'IPXXC', true],
    ['IP65', 'IP65W', false],
    ['IP65W', 'IP65', true],
  ])('%s meets %s: %s', (have, need, expected) => {
    expect(satisfies(have, need)).toBe(expected);
  });

  it('a malformed code satisfies nothing', () => {
    expect(satisfies('IP7', 'IPX4')).toBe(false);
  });
});

describe('installation locations (common practice)', () => {
  it('has the trade minimums by default', () => {
    // common practice (REFERENCES [practice]): sheltered IPX4, exposed IP65, driver outdoors IP65,
    // in-ground IP67, buried connections IP68, submerged IP68
    expect(DEFAULT_MINIMUM_IP['sheltered-outdoor']).toBe('IPX4');
    expect(DEFAULT_MINIMUM_IP['exposed-outdoor']).toBe('IP65');
    expect(DEFAULT_MINIMUM_IP['driver-outdoors']).toBe('IP65');
    expect(DEFAULT_MINIMUM_IP['in-ground-walk-over']).toBe('IP67');
    expect(DEFAULT_MINIMUM_IP['buried-connection']).toBe('IP68');
    expect(DEFAULT_MINIMUM_IP.submerged).toBe('IP68');
    expect(minimumIpFor('exposed-outdoor').source).toBe('default');
  });

  it('takes the firm override, and warns and falls back on a bad one', () => {
    const own = minimumIpFor('in-ground-walk-over', { 'in-ground-walk-over': 'IP68' });
    expect(own.source).toBe('firm');
    expect(own.requirement.text).toBe('IP68');
    const bad = minimumIpFor('in-ground-walk-over', { 'in-ground-walk-over': 'IP6' });
    expect(bad.source).toBe('default');
    expect(bad.findings[0]!.code).toBe('ip-override-malformed');
  });

  it('flags a product short of its location', () => {
    const short = checkIpForLocation('IP44', 'exposed-outdoor', { subject: 'fitting:2', prefix: 'fitting', what: 'Fitting 2' });
    expect(short.map((f) => f.code)).toEqual(['fitting-ip-short-of-location']);
    expect(short[0]!.message).toContain('IP65');
    const jetsOnly = checkIpForLocation('IP66', 'in-ground-walk-over', { subject: 'fitting:1', prefix: 'fitting', what: 'Fitting 1' });
    expect(jetsOnly[0]!.code).toBe('fitting-ip-short-of-location');
    expect(checkIpForLocation('IP67', 'in-ground-walk-over', { subject: 'f', prefix: 'fitting', what: 'F' })).toEqual([]);
    expect(checkIpForLocation(undefined, 'driver-outdoors', { subject: 'driver', prefix: 'driver', what: 'The driver' })[0]!.code).toBe(
      'ip-code-missing',
    );
    expect(checkIpForLocation('IP20', 'driver-outdoors', { subject: 'driver', prefix: 'driver', what: 'The driver' })[0]!.code).toBe(
      'driver-ip-short-of-location',
    );
    expect(checkIpForLocation('IP20', 'indoor-dry', { subject: 'driver', prefix: 'driver', what: 'The driver' })).toEqual([]);
  });
});
