// Which template renders each kind, and the data each kind needs.
import type { MailKind } from '../kinds';
import type { RenderedMail } from '../layout';
import { invitationMail, type InvitationMail } from './invitation';
import { passwordResetMail, type PasswordResetMail } from './password-reset';
import { runFinishedMail, type RunFinishedMail } from './run-finished';
import { briefReadyMail, type BriefReadyMail } from './brief-ready';
import { baselineDecisionMail, type BaselineDecisionMail } from './baseline-decision';

export type MailData = {
  invitation: InvitationMail;
  password_reset: PasswordResetMail;
  run_finished: RunFinishedMail;
  brief_ready: BriefReadyMail;
  baseline_decision: BaselineDecisionMail;
};

export type { InvitationMail, PasswordResetMail, RunFinishedMail, BriefReadyMail, BaselineDecisionMail };

const TEMPLATES: { [K in MailKind]: (data: MailData[K], recipientName?: string) => RenderedMail } = {
  invitation: invitationMail,
  password_reset: passwordResetMail,
  run_finished: runFinishedMail,
  brief_ready: briefReadyMail,
  baseline_decision: baselineDecisionMail,
};

export function renderMail<K extends MailKind>(
  kind: K,
  data: MailData[K],
  recipientName?: string,
): RenderedMail {
  return TEMPLATES[kind](data, recipientName);
}
