// The schedule's health check (lib/domain/schedule-health) as a list of findings, each naming its
// activities. Findings never stop a run: the words say so.
import { HEALTH_RULE_TITLES, type HealthFinding } from '@/lib/domain/schedule-health';

export function HealthFindings({
  findings,
  activityCount,
  context,
}: {
  findings: HealthFinding[];
  activityCount: number;
  /** Where it is shown: the schedule tab, the run form (where the run can still start), or a run's brief. */
  context: 'schedule' | 'run' | 'brief';
}) {
  const heading =
    context === 'run'
      ? "The schedule's health check before this run"
      : context === 'brief'
        ? 'Health check of the network this run read'
        : 'Health check of the network';
  if (activityCount === 0) return null;
  return (
    <section
      aria-label={heading}
      className={`rounded border px-3 py-2 text-sm ${
        findings.length
          ? 'border-caution/50 bg-caution-light text-caution-dark'
          : 'border-rule bg-paper-raised'
      }`}
    >
      <h2 className="font-semibold">
        {heading}:{' '}
        {findings.length === 0
          ? 'no findings.'
          : `${findings.length} ${findings.length === 1 ? 'finding' : 'findings'} to look at.`}
      </h2>
      {findings.length ? (
        <ul className="mt-1 space-y-0.5">
          {findings.map((f) => (
            <li key={f.rule} data-rule={f.rule}>
              <span className="font-medium">{HEALTH_RULE_TITLES[f.rule]}:</span> {f.message}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-1 text-xs text-ink-soft">
        {context === 'run'
          ? 'The run can go ahead with these findings; its results are only as sound as the network.'
          : context === 'brief'
            ? 'Common checks of schedule logic, on the network as the run read it; the finish figures are only as sound as that network.'
            : 'Common checks of schedule logic; a run can go ahead with findings, but its results are only as sound as the network.'}
      </p>
    </section>
  );
}
