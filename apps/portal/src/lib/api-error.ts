import type { FieldError, PortalFirmContact, PortalLinkState } from '@gloaming/contracts';

export type ApiErrorInit = {
  status: number;
  title: string;
  detail: string;
  type?: string;
  fieldErrors?: FieldError[];
  retryAfterSeconds?: number;
  linkState?: PortalLinkState;
  firm?: PortalFirmContact;
  currentLink?: string;
};

/**
 * Every failed api call: an RFC 9457 problem from the server (with the portal's link state and
 * the firm to contact when the link does not open a quote), an answer of the wrong shape, or
 * no answer at all (status 0). `detail` is always a sentence a person can read.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly title: string;
  readonly detail: string;
  readonly type: string;
  readonly fieldErrors: readonly FieldError[];
  readonly retryAfterSeconds: number | undefined;
  readonly linkState: PortalLinkState | undefined;
  readonly firm: PortalFirmContact | undefined;
  readonly currentLink: string | undefined;

  constructor(init: ApiErrorInit) {
    super(init.detail);
    this.name = 'ApiError';
    this.status = init.status;
    this.title = init.title;
    this.detail = init.detail;
    this.type = init.type ?? 'about:blank';
    this.fieldErrors = init.fieldErrors ?? [];
    this.retryAfterSeconds = init.retryAfterSeconds;
    this.linkState = init.linkState;
    this.firm = init.firm;
    this.currentLink = init.currentLink;
  }

  /** The message for one field, matched by its last path segment: `body.signedName` answers `signedName`. */
  messageFor(field: string): string | undefined {
    return this.fieldErrors.find((error) => error.path === field || error.path.endsWith(`.${field}`))?.message;
  }
}

export const isApiError = (error: unknown): error is ApiError => error instanceof ApiError;
