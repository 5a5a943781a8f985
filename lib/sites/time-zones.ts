// Offered in the site form; any valid IANA zone is accepted by the API.
export function timeZoneChoices(current?: string): string[] {
  const all = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : ['UTC'];
  return current && !all.includes(current) ? [current, ...all] : all;
}
