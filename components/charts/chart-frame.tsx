// The frame every chart sits in: a title, the one-line reading, the chart, and a footnote.
export function ChartFrame({
  title,
  reading,
  note,
  height = 260,
  children,
  testId,
}: {
  title: string;
  reading: React.ReactNode;
  note?: React.ReactNode;
  height?: number;
  children: React.ReactNode;
  testId?: string;
}) {
  return (
    <figure className="rounded border border-rule bg-paper-raised p-3" data-testid={testId}>
      <figcaption className="mb-2">
        <h3 className="text-sm font-semibold text-ink">{title}</h3>
        <p className="text-sm text-ink-soft">{reading}</p>
      </figcaption>
      <div style={{ height }} className="relative">
        {children}
      </div>
      {note ? <p className="mt-1.5 text-xs text-ink-faint">{note}</p> : null}
    </figure>
  );
}
