import type { OrgContext } from '../../org-context';

/**
 * The plan's limit on active assets, checked when an asset is created or restored.
 * Until subscriptions exist every organisation is unlimited.
 */
export async function assertAssetLimit(_ctx: OrgContext): Promise<void> {}
