import { formatDate } from '@/lib/format';
import { renderMessage, type RenderedMail } from '../layout';

export type InvitationMail = {
  organizationName: string;
  invitedByName: string;
  /** The role's label as members see it, e.g. "Sponsor". */
  roleLabel: string;
  acceptUrl: string;
  expiresAt: Date | string;
};

export function invitationMail(d: InvitationMail): RenderedMail {
  return renderMessage({
    subject: `${d.invitedByName} invited you to ${d.organizationName} on Outturn`,
    heading: `Join ${d.organizationName} on Outturn`,
    paragraphs: [
      `${d.invitedByName} has invited you to work with ${d.organizationName} in Outturn as ${d.roleLabel.toLowerCase()}.`,
      'Outturn holds the organisation’s cost and schedule risk analyses: the estimates, the risk registers, the simulated confidence levels and the briefs that go to sponsors.',
      'Accept the invitation to create your account, or to add the organisation to the account you already have.',
    ],
    action: { label: 'Accept the invitation', url: d.acceptUrl },
    note: `The invitation can be used once, until ${formatDate(d.expiresAt)}.`,
    optional: false,
  });
}
