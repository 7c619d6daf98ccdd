/** The storage's origin for the page policy, or null when the setting is not a valid URL. No SDK here: proxy.ts imports it. */
export function storageOrigin(endpoint: string | undefined): string | null {
  if (!endpoint) return null;
  try {
    return new URL(endpoint).origin;
  } catch {
    return null;
  }
}
