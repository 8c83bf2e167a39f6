/**
 * The one table of errors drydig reports, with stable codes, HTTP status and a how-to-fix line.
 *
 * The server maps every failure to one of these; the CLI prints `code: message` and exits 2;
 * the client shows `message` and `fix`. A test keeps this table and the README's list in sync.
 * Add rows; never change the meaning of an existing code.
 */
export const ERROR_TABLE = {
  DRYDIG_ERR_INVALID_SCENARIO: {
    status: 400,
    title: 'The scenario is not valid',
    fix: 'Correct the field named in the message; see the scenario format in the README.',
  },
  DRYDIG_ERR_INVALID_REQUEST: {
    status: 400,
    title: 'The request body or parameters are not valid',
    fix: 'Correct the field named in the message; see /api/v1/openapi.json.',
  },
  DRYDIG_ERR_INVALID_IMPORT: {
    status: 400,
    title: 'The imported file (AGS, DXF or logger readings) cannot be read',
    fix: 'Correct the line or entity named in the message, or export the file again from its source program; see the import formats in the README.',
  },
  DRYDIG_ERR_INVALID_READINGS: {
    status: 400,
    title: 'The pumping-test readings are not valid',
    fix: 'Correct the rows named by line number (time > 0, numbers in every column, units as column suffixes); see the pumping-test format in the README.',
  },
  DRYDIG_ERR_MALFORMED_JSON: {
    status: 400,
    title: 'The body is not well-formed JSON',
    fix: 'Send a JSON document with Content-Type: application/json.',
  },
  DRYDIG_ERR_BODY_TOO_LARGE: {
    status: 413,
    title: 'The request body is larger than the limit',
    fix: 'Send fewer points or a smaller scenario, or raise the limit with --body-limit.',
  },
  DRYDIG_ERR_GRID_TOO_LARGE: {
    status: 400,
    title: 'The requested grid has more nodes than the limit',
    fix: 'Use fewer nodes (coarser spacing) or evaluate in tiles.',
  },
  DRYDIG_ERR_UNSUPPORTED_BOUNDARIES: {
    status: 400,
    title: 'The boundary geometry is not one the image-well method handles',
    fix: 'Use one straight line, two perpendicular lines, or two parallel lines, with all wells on one side.',
  },
  DRYDIG_ERR_NO_STEADY_STATE: {
    status: 400,
    title: 'The aquifer has no steady state for this geometry',
    fix: 'Between two parallel no-flow boundaries nothing recharges the pumped water: give a design time (transient), make one side constant-head, or use a leaky aquifer.',
  },
  DRYDIG_ERR_UNSUPPORTED_MEDIA_TYPE: {
    status: 415,
    title: 'The body must be JSON',
    fix: 'Send Content-Type: application/json.',
  },
  DRYDIG_ERR_NOT_FOUND: {
    status: 404,
    title: 'Nothing is stored at that address',
    fix: 'Check the id or token; list what exists with GET /api/v1/scenarios.',
  },
  DRYDIG_ERR_TOO_MANY_POINTS: {
    status: 400,
    title: 'The request asks for more points than the limit',
    fix: 'Send fewer points or times per request, or split the points over several requests.',
  },
  DRYDIG_ERR_NO_ROUTE: {
    status: 404,
    title: 'There is no such address',
    fix: 'Check the method and path; the API\u2019s routes are listed at /api/v1/openapi.json.',
  },
  DRYDIG_ERR_RATE_LIMITED: {
    status: 429,
    title: 'Too many requests',
    fix: 'Wait a moment and try again.',
  },
  DRYDIG_ERR_REVISION_CONFLICT: {
    status: 409,
    title: 'Someone saved a newer revision since this edit began',
    fix: 'Open the latest revision (sent with this answer), merge your changes into it and save again.',
  },
  DRYDIG_ERR_LINK_READ_ONLY: {
    status: 403,
    title: 'This share link can only view',
    fix: 'Ask the designer for an edit link to save changes or enter readings.',
  },
  DRYDIG_ERR_LINK_REVOKED: {
    status: 410,
    title: 'This share link has been revoked',
    fix: 'Ask the designer for a new link.',
  },
  DRYDIG_ERR_SIGN_IN_REQUIRED: {
    status: 401,
    title: 'Sign in first',
    fix: 'Sign in with your drydig account (an admin adds accounts with `drydig user add`).',
  },
  DRYDIG_ERR_SIGN_IN_FAILED: {
    status: 401,
    title: 'The user name or password is wrong, or the account is disabled',
    fix: 'Check the user name and password; an admin can reset it with `drydig user reset`.',
  },
  DRYDIG_ERR_ROLE_FORBIDDEN: {
    status: 403,
    title: 'Your role may not do this',
    fix: 'Viewers can read only; ask an admin for the designer role.',
  },
  DRYDIG_ERR_CSRF: {
    status: 403,
    title: 'The request lacks the form token of your session',
    fix: 'Reload the page and try again (writes need the x-drydig-csrf header from GET /api/v1/auth/session).',
  },
  DRYDIG_ERR_SETUP_LINK_INVALID: {
    status: 410,
    title: 'This setup link has been used or is not valid',
    fix: 'Sign in with the account made at setup, or make one with `drydig user add`.',
  },
  DRYDIG_ERR_STORED_DATA_DAMAGED: {
    status: 500,
    title: 'A stored revision does not match its checksum',
    fix: 'Open another revision; restore the data folder from a backup and report it.',
  },
  DRYDIG_ERR_CLI_USAGE: {
    status: 400,
    title: 'The command line is not valid',
    fix: 'Run `drydig --help` for the commands and their options.',
  },
  DRYDIG_ERR_FILE: {
    status: 400,
    title: 'A file could not be read',
    fix: 'Check the path and that the file is readable JSON or CSV.',
  },
  DRYDIG_ERR_INVALID_SECTION: {
    status: 400,
    title: 'The section document is not valid',
    fix: 'Correct the field named in the message; see the section format in the README.',
  },
  DRYDIG_ERR_SECTION_TOO_LARGE: {
    status: 400,
    title: 'The section mesh would have more cells than the limit',
    fix: 'Give a larger mesh.maxSize_m / minSize_m or a smaller mesh.subdivide.',
  },
  DRYDIG_ERR_COMPUTE_TIMEOUT: {
    status: 503,
    title: 'The computation did not finish within its time budget',
    fix: 'Use a coarser mesh or fewer options, or try again when the service is less busy.',
  },
  DRYDIG_ERR_BUSY: {
    status: 503,
    title: 'The service is busy: too many computations are waiting',
    fix: 'Try again after the seconds given in Retry-After; send fewer requests at once.',
  },
  DRYDIG_ERR_CANCELLED: {
    status: 503,
    title: 'The computation was cancelled before it finished',
    fix: 'The request went away or the service is stopping; send it again.',
  },
  DRYDIG_ERR_WORK_TOO_LARGE: {
    status: 413,
    title: 'The request asks for more computation than the limit (wells × points × times)',
    fix: 'Ask for fewer points, grid nodes or times, or split the request; the message gives the limit.',
  },
  DRYDIG_ERR_HOST_NOT_ALLOWED: {
    status: 421,
    title: 'The request names a host this service does not answer for',
    fix: 'Use the service under one of its configured host names (drydig serve --host-name NAME).',
  },
  DRYDIG_ERR_INTERNAL: {
    status: 500,
    title: 'An unexpected error (a bug in drydig)',
    fix: 'Report it with the request that caused it; nothing was stored.',
  },
} as const satisfies Record<string, { status: number; title: string; fix: string }>;

export type ErrorCode = keyof typeof ERROR_TABLE;

/** One problem with an input, located by its JSON pointer (RFC 6901), e.g. `/aquifer/storativity`. */
export interface FieldIssue {
  /** JSON pointer of the offending field ('' for the whole document). */
  path: string;
  /** What is wrong, in words a designer understands. */
  message: string;
}

/** An error carrying a stable code; thrown by the engine and the server's validators. */
export class DrydigError extends Error {
  readonly code: ErrorCode;
  readonly issues: FieldIssue[];
  constructor(code: ErrorCode, message: string, issues: FieldIssue[] = []) {
    super(message);
    this.name = 'DrydigError';
    this.code = code;
    this.issues = issues;
  }
  get status(): number {
    return ERROR_TABLE[this.code].status;
  }
}

/** One-line summary of field issues: "/aquifer/storativity: required for a confined aquifer (+2 more)". */
export function summariseIssues(issues: FieldIssue[], prefix = ''): string {
  const first = issues[0];
  if (!first) return 'invalid input';
  const where = `${prefix}${first.path}` || '(document)';
  const more = issues.length > 1 ? ` (+${issues.length - 1} more)` : '';
  return `${where}: ${first.message}${more}`;
}
