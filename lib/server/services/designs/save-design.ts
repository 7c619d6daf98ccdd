import { z } from 'zod';
import { text } from '@/lib/schemas/text';
import { deskInputsSchema } from '@/lib/schemas/design';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { getDesignOrThrow } from './get-design';
import { assertEditable, storeResults } from './store-results';

const saveSchema = z.object({ title: text().trim().min(1, 'Give the design a title.').max(160), inputs: deskInputsSchema });

/** Saves a draft's inputs with freshly computed results. A checked draft that changes needs checking again. */
export async function saveDesign(ctx: OrgContext, designId: string, input: unknown) {
  requirePermission(ctx, 'design:write');
  const { title, inputs } = saveSchema.parse(input);
  const design = await getDesignOrThrow(ctx, designId);
  assertEditable(design);
  design.title = title;
  const desk = await storeResults(ctx, design, inputs);
  if (design.status === 'checked') {
    design.status = 'draft';
    design.checkedBy = null;
    design.checkedAt = null;
  }
  audit(ctx, { action: 'design.saved', targetType: 'design', targetId: design.id, details: { revision: design.revision } });
  return { design, desk };
}
