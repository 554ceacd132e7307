import 'server-only';
/**
 * Outturn's e-mail. Every mail goes through the outbox:
 *
 *   1. A service calls `enqueueMail(kind, recipients, data, transaction)` (or one of the
 *      `notify…` helpers) inside the transaction of the action that causes the mail. The
 *      rendered mail (subject, HTML and text) is written to OutboundMessages with that
 *      transaction: a rolled-back action sends nothing, a committed one always sends.
 *   2. The sender (`deliverPending`, started by instrumentation.ts in the server process and
 *      polling every 2 s; also kicked right after each commit) sends due rows over SMTP.
 *      A failed send stays `pending` with `lastError` and is retried with a growing delay
 *      (15 s, 30 s, 1 min … 1 h); after MAX_ATTEMPTS it is marked `failed`.
 *   3. Members turn the optional kinds off on /settings/notifications; `enqueueMail` skips
 *      them. Invitations and password resets are always sent.
 *
 * For the runs and approvals services (recipientsWithRole is in lib/services/notifications):
 *
 *   await notifyRunFinished({ userId, email, name },
 *     { projectId, projectName, runId, outcome: 'succeeded', p80Text }, transaction);
 *
 *   const sponsors = await recipientsWithRole(actor.organizationId, ['sponsor'], transaction);
 *   await notifyBriefReady(sponsors,
 *     { projectId, projectName, runId, p80Text, preparedByName: actor.name }, transaction);
 *
 *   const estimators = await recipientsWithRole(actor.organizationId, ['estimator'], transaction);
 *   await notifyDecision(estimators,
 *     { projectId, projectName, runId, decision: 'approved', comment, decidedByName: actor.name,
 *       p80Text }, transaction);
 *
 * Links in the mails: the outcome at /projects/:id/runs/:runId, the brief at
 * /projects/:id/runs/:runId/brief (absolute, from APP_URL).
 *
 * In development the mail lands in the local fake at http://localhost:2580 (scripts/fakes/mail.ts);
 * tests read it with `scripts/fakes/mail/client.ts`.
 */
export { MAIL_KINDS, OPTIONAL_KINDS, NOTICE_LABELS, isOptionalKind } from './kinds';
export type { MailKind, OptionalMailKind } from './kinds';
export { enqueueMail } from './outbox';
export type { MailRecipient } from './outbox';
export { notifyRunFinished, notifyBriefReady, notifyDecision } from './notify';
export { deliverPending, startMailSender, stopMailSender, kickMailSender } from './sender';
export { retryDelayMs, MAX_ATTEMPTS } from './retry';
export type { DeliveryOptions, DeliveryReport } from './sender';
export { renderMail } from './templates';
export type {
  MailData,
  InvitationMail,
  PasswordResetMail,
  RunFinishedMail,
  BriefReadyMail,
  BaselineDecisionMail,
} from './templates';
