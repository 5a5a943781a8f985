// One id per request, for matching a response (and what a user reports) to the log lines it
// caused. A well-formed id sent by a reverse proxy or client is kept, so one id can follow a
// request through several systems; anything else is replaced. No framework imports: the proxy
// and the route wrapper both use it.

export const REQUEST_ID_HEADER = 'x-request-id';

// Letters, digits and . _ : - only, 8 to 128 of them: enough for a UUID, a trace id or a
// load balancer's id, and nothing that could split a log line or a header.
const WELL_FORMED = /^[A-Za-z0-9._:-]{8,128}$/;

export function isWellFormedRequestId(value: string | null | undefined): value is string {
  return typeof value === 'string' && WELL_FORMED.test(value);
}

/** The incoming id when it is well-formed, else a fresh one. */
export function requestIdFrom(headers: Pick<Headers, 'get'>): string {
  const incoming = headers.get(REQUEST_ID_HEADER);
  return isWellFormedRequestId(incoming) ? incoming : crypto.randomUUID();
}
