import { describe, expect, it } from 'vitest';
import { ColumnMapping, CustomerInput, DriveRating, IpCodeText, ProductInput } from '../src';

describe('IP code text', () => {
  // IEC 60529: first digit 0-6 (solids), second 0-9 (water; 9 from Amd 2:2013), X for "not tested"; ISO 20653 adds 9K
  // IEC 60529 clause 4 (code arrangement) and Annex on dual marking; 9K from ISO 20653.
  it.each(['IP65', 'ip67', 'IPX4', 'IP6X', 'IP68', 'IP69K', ' IP44 ', 'IP66/IP67', 'IP66/67', 'IP44D', 'IP65W'])('accepts %s', (text) => {
    expect(IpCodeText.safeParse(text).success).toBe(true);
  });
  it.each(['IP76', 'IP7', 'IP', '65', 'IP6A', 'IP65/IP68x'])('refuses %s', (text) => {
    expect(IpCodeText.safeParse(text).success).toBe(false);
  });
  it('stores the code upper-case and trimmed', () => {
    expect(IpCodeText.parse(' ip67 ')).toBe('IP67');
    expect(IpCodeText.parse('ip66/67')).toBe('IP66/IP67');
  });
});

describe('drive ratings', () => {
  it('needs the forward voltage or the power at each current (P = Vf · I, definition)', () => {
    expect(DriveRating.safeParse({ currentA: 0.35 }).success).toBe(false);
    expect(DriveRating.safeParse({ currentA: 0.35, powerW: 1 }).success).toBe(true);
    expect(DriveRating.safeParse({ currentA: 0.35, forwardVoltageV: 2.9 }).success).toBe(true);
  });
});

describe('product input', () => {
  it('checks the spec against the schema of the product’s own kind', () => {
    const base = { supplier: 'S', supplierCode: 'C', name: 'N', costMinor: 100, listPriceMinor: 200 };
    // a cable spec under a connector-block kind is refused with the block's missing fields
    const wrong = ProductInput.safeParse({ ...base, kind: 'connector-block', spec: { cores: 2, conductor: { kind: 'awg', gauge: 14 } } });
    expect(wrong.success).toBe(false);
    if (!wrong.success) expect(wrong.error.issues.map((i) => i.path.join('.'))).toEqual(expect.arrayContaining(['spec.terminals', 'spec.entries', 'spec.ipCode']));
    const cable = ProductInput.parse({ ...base, kind: 'cable', spec: { cores: 2, conductor: { kind: 'awg', gauge: 14 } } });
    expect(cable.kind === 'cable' && cable.spec.conductor).toEqual({ kind: 'awg', gauge: 14, stranding: 'stranded' });
    expect(cable.unit).toBe('each');
    expect(cable.active).toBe(true);
  });

  it('refuses fractional pence and negative prices', () => {
    const base = { kind: 'accessory', supplier: 'S', supplierCode: 'C', name: 'N', spec: {} };
    expect(ProductInput.safeParse({ ...base, costMinor: 12.5, listPriceMinor: 1 }).success).toBe(false);
    expect(ProductInput.safeParse({ ...base, costMinor: -1, listPriceMinor: 1 }).success).toBe(false);
  });
});

describe('customers and mappings', () => {
  it('turns an empty e-mail or phone into null and needs a site', () => {
    const parsed = CustomerInput.parse({ name: ' Ada ', email: '', phone: '', sites: [{ addressLines: '1 Lane' }] });
    expect(parsed).toMatchObject({ name: 'Ada', email: null, phone: null, sites: [{ label: '', postcode: '', accessNotes: '' }] });
    expect(CustomerInput.safeParse({ name: 'Ada', sites: [] }).success).toBe(false);
  });

  it('a column mapping names the supplier-code and name columns', () => {
    expect(ColumnMapping.safeParse({ defaultKind: 'fitting', columns: { supplierCode: 'Code', name: 'Name' } }).success).toBe(true);
    const missing = ColumnMapping.safeParse({ defaultKind: 'fitting', columns: { supplierCode: 'Code' } });
    expect(missing.success).toBe(false);
    if (!missing.success) expect(missing.error.issues.map((i) => i.path.join('.'))).toEqual(['columns.name']);
  });
});
