import 'server-only';
/**
 * The organisation's own settings, changed by its owners. Today one: whether the person who
 * started a run may also approve it as the baseline (separation of duties, off by default).
 */
import type { Transaction } from 'sequelize';
import { z } from 'zod';
import { Organization, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import type { OrganizationSettings } from '@/lib/view-types/organization';
import { recordAudit } from './audit';

const settingsSchema = z.object({
  allowSelfApproval: z.boolean({
    message: 'allowSelfApproval is true (the person who started a run may approve it) or false.',
  }),
});

function toView(org: Organization): OrganizationSettings {
  return { name: org.name, allowSelfApproval: org.allowSelfApproval };
}

/** Whether the organisation lets whoever started a run approve it too (read by the approval rule). */
export async function selfApprovalAllowed(
  organizationId: number,
  transaction?: Transaction,
): Promise<boolean> {
  const org = await Organization.findByPk(organizationId, {
    attributes: ['id', 'allowSelfApproval'],
    transaction,
  });
  return org?.allowSelfApproval ?? false;
}

export async function getOrganizationSettings(actor: Actor): Promise<OrganizationSettings> {
  if (!can(actor.role, 'organization:manage')) throw forbidden('Only owners change the organisation.');
  const org = await Organization.findByPk(actor.organizationId);
  if (!org) throw notFound('Organisation');
  return toView(org);
}

export async function updateOrganizationSettings(
  actor: Actor,
  input: unknown,
): Promise<OrganizationSettings> {
  if (!can(actor.role, 'organization:manage')) throw forbidden('Only owners change the organisation.');
  const data = parseOrThrow(settingsSchema, input);
  return sequelize.transaction(async (transaction) => {
    const org = await Organization.findByPk(actor.organizationId, {
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!org) throw notFound('Organisation');
    const before = toView(org);
    if (before.allowSelfApproval === data.allowSelfApproval) return before;
    await org.update({ allowSelfApproval: data.allowSelfApproval }, { transaction });
    const after = toView(org);
    await recordAudit(
      actor,
      { entity: 'organization', entityId: org.id, action: 'update', before, after },
      transaction,
    );
    return after;
  });
}
