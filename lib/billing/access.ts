// Whether an organisation may edit, from its subscription as mirrored. Pure, so that the
// rule reads in one place: past due (or unpaid), cancelled and ended, or a trial that ran
// out without a subscription, make the organisation read-only until it pays.

export type AccessState = {
  status: string;
  trialEndsAt: Date | null;
  currentPeriodEnd: Date | null;
  endedAt: Date | null;
  stripeSubscriptionId: string | null;
};

export type ReadOnlyReason = 'past_due' | 'ended' | 'trial_ended';
export type Access = { readOnly: boolean; reason: ReadOnlyReason | null };

export function accessOf(subscription: AccessState | null, at: Date = new Date()): Access {
  if (!subscription) return { readOnly: false, reason: null };
  const s = subscription;
  if (s.status === 'past_due' || s.status === 'unpaid') return { readOnly: true, reason: 'past_due' };
  if (s.status === 'canceled' || s.status === 'incomplete_expired') {
    const end = s.endedAt ?? s.currentPeriodEnd;
    if (!end || end <= at) return { readOnly: true, reason: 'ended' };
  }
  if (s.status === 'trialing' && !s.stripeSubscriptionId && s.trialEndsAt && s.trialEndsAt <= at)
    return { readOnly: true, reason: 'trial_ended' };
  return { readOnly: false, reason: null };
}

export const READ_ONLY_MESSAGES: Record<ReadOnlyReason, string> = {
  past_due:
    'This organisation is read-only until the subscription is paid: the last payment failed. Your data is kept and exports still work.',
  ended:
    'This organisation is read-only until the subscription is paid again: it was cancelled and has ended. Your data is kept and exports still work.',
  trial_ended:
    'This organisation is read-only until a subscription is paid: the 14-day trial has ended. Your data is kept and exports still work.',
};
