// The kinds of e-mail Outturn sends. Kept free of server imports so that pages and
// client components can show the list.

export const MAIL_KINDS = [
  'invitation',
  'password_reset',
  'run_finished',
  'brief_ready',
  'baseline_decision',
] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/** Notices a member may turn off. Invitations and reset links are always sent: they are asked for. */
export const OPTIONAL_KINDS = ['run_finished', 'brief_ready', 'baseline_decision'] as const;
export type OptionalMailKind = (typeof OPTIONAL_KINDS)[number];

export function isOptionalKind(kind: string): kind is OptionalMailKind {
  return (OPTIONAL_KINDS as readonly string[]).includes(kind);
}

export const NOTICE_LABELS: Record<OptionalMailKind, { title: string; description: string }> = {
  run_finished: {
    title: 'Run finished',
    description: 'When a simulation run you started finishes, fails or is cancelled.',
  },
  brief_ready: {
    title: 'Brief ready for a decision',
    description: 'When a run’s brief is put to the project’s sponsors for approval.',
  },
  baseline_decision: {
    title: 'Baseline approved or returned',
    description: 'When a sponsor approves a run as the baseline, or returns it with a comment.',
  },
};
