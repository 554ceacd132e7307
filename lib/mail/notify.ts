import 'server-only';
// One call per product event, for the services that cause them (runs, briefs, approvals).
// Each takes plain data and the caller's transaction, and queues the mail in the outbox.
import type { Transaction } from 'sequelize';
import { enqueueMail, type MailRecipient } from './outbox';
import type { BaselineDecisionMail, BriefReadyMail, RunFinishedMail } from './templates';

/** "Run finished" to whoever started the run. */
export function notifyRunFinished(
  run: RunFinishedMail & { startedBy: MailRecipient },
  transaction?: Transaction,
): Promise<number> {
  const { startedBy, ...data } = run;
  return enqueueMail('run_finished', [startedBy], data, transaction);
}

/** "Brief ready for a decision" to the project's sponsors (see recipientsWithRole). */
export function notifyBriefReady(
  brief: BriefReadyMail & { sponsors: MailRecipient[] },
  transaction?: Transaction,
): Promise<number> {
  const { sponsors, ...data } = brief;
  return enqueueMail('brief_ready', sponsors, data, transaction);
}

/** "Baseline approved / returned", with the sponsor's comment, to the project's estimators. */
export function notifyDecision(
  decision: BaselineDecisionMail & { estimators: MailRecipient[] },
  transaction?: Transaction,
): Promise<number> {
  const { estimators, ...data } = decision;
  return enqueueMail('baseline_decision', estimators, data, transaction);
}
