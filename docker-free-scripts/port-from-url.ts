// The local fakes take their port from the address the app is given (S3_ENDPOINT, SMTP_URL …), so
// one setting serves both ends.

/** The explicit port of an address, or undefined when there is none or it does not parse. */
export function portFromUrl(value: string | undefined): number | undefined {
  if (!value) return undefined;
  try {
    const port = new URL(value).port;
    return port ? Number(port) : undefined;
  } catch {
    return undefined;
  }
}
