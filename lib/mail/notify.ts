import 'server-only';
// One call per product event, for the services that cause them (runs, briefs, approvals).
// Each takes its recipients, the mail's plain data and the caller's transaction, and queues the
// mail in the outbox.
import type { Transaction } from 'sequelize';
import type { MailKind } from './kinds';
import { enqueueMail, type MailRecipient } from './outbox';
import type { MailData } from './templates';

const notifier =
  <K extends MailKind>(kind: K) =>
  (to: MailRecipient | MailRecipient[], data: MailData[K], transaction?: Transaction): Promise<number> =>
    enqueueMail(kind, [to].flat(), data, transaction);

/** "Run finished" to whoever started the run. */
export const notifyRunFinished = notifier('run_finished');

/** "Brief ready for a decision" to the project's sponsors (see recipientsWithRole). */
export const notifyBriefReady = notifier('brief_ready');

/** "Baseline approved / returned", with the sponsor's comment, to the project's estimators. */
export const notifyDecision = notifier('baseline_decision');
