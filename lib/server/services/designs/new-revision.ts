import { DesignSchema, UserSchema } from '@/entities';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { APP_VERSION } from '../../app-version';
import { getDesignOrThrow } from './get-design';
import { nextRevision } from './create-design';
import { readDesignRecord } from './read-design-record';

/** A new draft revision carrying over the inputs of any revision (usually the approved one). */
export async function newRevision(ctx: OrgContext, designId: string) {
  requirePermission(ctx, 'design:write');
  const source = await getDesignOrThrow(ctx, designId);
  // Parsed on the way out of the source row; the parse returns fresh objects, so nothing is shared between the rows.
  const record = readDesignRecord(source);
  const revision = await nextRevision(ctx, source.asset.id);
  const design = ctx.em.create(DesignSchema, {
    organisation: ctx.organisation,
    asset: source.asset,
    revision,
    title: source.title,
    status: 'draft',
    ...record,
    appVersion: APP_VERSION,
    preparedBy: ctx.em.getReference(UserSchema, ctx.user.id),
    basedOnRevision: source.revision,
    checkedBy: null,
    approvedBy: null,
    checkedAt: null,
    approvedAt: null,
  });
  audit(ctx, { action: 'design.revised', targetType: 'design', targetId: design.id, details: { from: source.revision, to: revision, asset: source.asset.name } });
  return design;
}
