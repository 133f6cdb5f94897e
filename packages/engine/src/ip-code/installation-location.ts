import { finding, type Finding } from '../findings';
import { parseIpCode, satisfies, type IpCode } from './ip-code';

/** Where a fitting or driver is installed; each has a default minimum IP code. */
export const INSTALLATION_LOCATIONS = [
  'indoor-dry',
  'sheltered-outdoor',
  'exposed-outdoor',
  'under-decking',
  'in-ground-walk-over',
  'buried-connection',
  'submerged',
  'driver-outdoors',
] as const;
export type InstallationLocation = (typeof INSTALLATION_LOCATIONS)[number];

/**
 * Default minimum IP codes by location — common practice in the trade, not a standard:
 * sheltered outdoor IPX4; exposed outdoor IP65; a driver outdoors (even sheltered, under
 * decking) IP65; under decking IP65; in-ground / walk-over IP67 (IP68 where waterlogged:
 * override per firm); connections buried or in wet ground IP68; submerged (pond) IP68, rated
 * for the depth (check the datasheet). Indoor dry IP20 (finger-safe).
 */
export const DEFAULT_MINIMUM_IP: Readonly<Record<InstallationLocation, string>> = {
  'indoor-dry': 'IP20',
  'sheltered-outdoor': 'IPX4',
  'exposed-outdoor': 'IP65',
  'under-decking': 'IP65',
  'in-ground-walk-over': 'IP67',
  'buried-connection': 'IP68',
  submerged: 'IP68',
  'driver-outdoors': 'IP65',
};

/** A firm's own minimums, replacing the defaults location by location. */
export type IpOverrides = Partial<Record<InstallationLocation, string>>;

const LOCATION_LABEL: Record<InstallationLocation, string> = {
  'indoor-dry': 'indoors (dry)',
  'sheltered-outdoor': 'sheltered outdoors',
  'exposed-outdoor': 'exposed outdoors',
  'under-decking': 'under decking',
  'in-ground-walk-over': 'in the ground (walk-over)',
  'buried-connection': 'in a buried connection',
  submerged: 'submerged',
  'driver-outdoors': 'outdoors (driver)',
};

export function describeLocation(location: InstallationLocation): string {
  return LOCATION_LABEL[location];
}

export function isInstallationLocation(x: unknown): x is InstallationLocation {
  return typeof x === 'string' && (INSTALLATION_LOCATIONS as readonly string[]).includes(x);
}

export interface MinimumIp {
  location: InstallationLocation;
  requirement: IpCode;
  source: 'default' | 'firm';
  findings: Finding[];
}

/**
 * The minimum IP code for a location: the firm's override when it parses, else the default
 * (a malformed override gives an `ip-override-malformed` warning and falls back).
 */
export function minimumIpFor(location: InstallationLocation, overrides: IpOverrides = {}): MinimumIp {
  const findings: Finding[] = [];
  const own = overrides[location];
  if (own !== undefined) {
    const parsed = parseIpCode(own);
    if (parsed.ok) return { location, requirement: parsed.code, source: 'firm', findings };
    findings.push(
      finding(
        'ip-override-malformed',
        'warning',
        `The firm's minimum IP code for ${describeLocation(location)} ("${own}") is not a valid IP code; using the default ${DEFAULT_MINIMUM_IP[location]}.`,
        { values: { location, ipCode: own } },
      ),
    );
  }
  const def = parseIpCode(DEFAULT_MINIMUM_IP[location]);
  if (!def.ok) throw new Error(`engine bug: default IP code for ${location} does not parse`);
  return { location, requirement: def.code, source: 'default', findings };
}

/**
 * Findings for a product's IP code at a location: `ip-code-missing` (warning) when none is
 * known, `ip-code-malformed` (error), or `<prefix>-ip-short-of-location` (error) when it falls
 * short. `prefix` is `fitting` or `driver`.
 */
export function checkIpForLocation(
  ipCode: string | undefined,
  location: InstallationLocation | undefined,
  opts: { subject: string; prefix: 'fitting' | 'driver'; overrides?: IpOverrides; what: string },
): Finding[] {
  if (location === undefined) return [];
  if (!isInstallationLocation(location)) {
    return [
      finding('location-unknown', 'error', `${opts.what}: "${String(location)}" is not a known installation location.`, {
        subject: opts.subject,
      }),
    ];
  }
  const min = minimumIpFor(location, opts.overrides);
  const out = [...min.findings];
  if (ipCode === undefined || ipCode === '') {
    out.push(
      finding(
        'ip-code-missing',
        'warning',
        `${opts.what} has no IP code; ${describeLocation(location)} needs at least ${min.requirement.text}.`,
        { subject: opts.subject, values: { location, requiredIp: min.requirement.text } },
      ),
    );
    return out;
  }
  const parsed = parseIpCode(ipCode, opts.subject);
  if (!parsed.ok) return [...out, ...parsed.findings];
  if (!satisfies(parsed.code, min.requirement)) {
    out.push(
      finding(
        `${opts.prefix}-ip-short-of-location`,
        'error',
        `${opts.what} is ${parsed.code.text}, short of the ${min.requirement.text} needed ${describeLocation(location)}.`,
        { subject: opts.subject, values: { ipCode: parsed.code.text, requiredIp: min.requirement.text, location } },
      ),
    );
  }
  return out;
}
