import 'server-only';
/**
 * The organisation's own settings, changed by its owners: whether the person who started a run
 * may also approve it as the baseline (separation of duties, off by default), and the joint
 * confidence at which each run draws its frontier of cost and finish pairs (70 % by default).
 */
import type { Transaction } from 'sequelize';
import { Organization, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { DEFAULT_JOINT_CONFIDENCE, organizationSettingsSchema } from '@/lib/validation/organization';
import type { OrganizationSettings } from '@/lib/view-types/organization';
import { recordAudit } from './audit';

function toView(org: Organization): OrganizationSettings {
  return { name: org.name, allowSelfApproval: org.allowSelfApproval, jointConfidence: org.jointConfidence };
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

/** The joint confidence (a fraction, e.g. 0.7) at which a run of this organisation draws its frontier. */
export async function jointConfidenceOf(organizationId: number): Promise<number> {
  const org = await Organization.findByPk(organizationId, { attributes: ['id', 'jointConfidence'] });
  return (org?.jointConfidence ?? DEFAULT_JOINT_CONFIDENCE) / 100;
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
  const data = parseOrThrow(organizationSettingsSchema, input);
  return sequelize.transaction(async (transaction) => {
    const org = await Organization.findByPk(actor.organizationId, {
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!org) throw notFound('Organisation');
    const before = toView(org);
    const changes = {
      allowSelfApproval: data.allowSelfApproval ?? before.allowSelfApproval,
      jointConfidence: data.jointConfidence ?? before.jointConfidence,
    };
    if (
      before.allowSelfApproval === changes.allowSelfApproval &&
      before.jointConfidence === changes.jointConfidence
    )
      return before;
    await org.update(changes, { transaction });
    const after = toView(org);
    await recordAudit(
      actor,
      { entity: 'organization', entityId: org.id, action: 'update', before, after },
      transaction,
    );
    return after;
  });
}
