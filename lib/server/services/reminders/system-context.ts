import type { EntityManager } from '@mikro-orm/postgresql';
import type { Membership, Organisation } from '@/entities';
import type { OrgContext } from '../../org-context';

/** The scheduler acts inside an organisation as itself: it reads, recomputes and sends; it never edits users' data. */
export function systemContext(em: EntityManager, organisation: Organisation): OrgContext {
  return {
    em,
    organisation,
    role: 'owner',
    membership: { role: 'owner' } as Membership,
    user: { id: '00000000-0000-0000-0000-000000000000', email: 'scheduler@tidewarden.invalid', name: 'Tidewarden scheduler', emailVerified: true },
    ip: null,
  };
}
