const TONES = {
  info: 'border-cost/40 bg-cost-light text-cost-dark',
  caution: 'border-caution/50 bg-caution-light text-caution-dark',
  invalid: 'border-invalid/50 bg-invalid-light text-invalid',
  success: 'border-cost/40 bg-paper-raised text-cost-dark',
};

export function Notice({
  tone = 'info',
  title,
  children,
}: {
  tone?: keyof typeof TONES;
  title?: string;
  children: React.ReactNode;
}) {
  return (
    <div
      role={tone === 'invalid' ? 'alert' : 'status'}
      className={`rounded border px-3 py-2 text-sm ${TONES[tone]}`}
    >
      {title ? <p className="font-semibold">{title}</p> : null}
      <div>{children}</div>
    </div>
  );
}

/** The cautions shown wherever simulated results are read. */
export function ResultCautions() {
  return (
    <Notice tone="caution" title="Read these figures with care">
      Results are only as good as the ranges entered. They support, and do not replace, professional
      judgement, your organisation&apos;s contingency policy and the funding body&apos;s rules.
    </Notice>
  );
}
