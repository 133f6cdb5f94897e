import type { PortalFirmContact } from '@gloaming/contracts';

/** The firm's name, address and the person to write to. */
export function FirmContact({ firm }: { firm: PortalFirmContact }) {
  return (
    <address className="not-italic">
      <p className="font-semibold text-ink">{firm.name}</p>
      {firm.addressLines.map((line) => (
        <p key={line} className="text-ink-muted">
          {line}
        </p>
      ))}
      {firm.contactEmail && (
        <p className="mt-2">
          {firm.contactName ? `${firm.contactName}: ` : ''}
          <a href={`mailto:${firm.contactEmail}`} className="font-semibold break-all text-dusk-600 underline underline-offset-4">
            {firm.contactEmail}
          </a>
        </p>
      )}
    </address>
  );
}
