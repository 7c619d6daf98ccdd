/** Only same-site paths may be used as a "come back here" target, never another host. */
export function safeNextPath(value: unknown, fallback = '/orgs'): string {
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  return value;
}
