// The schedule's health check (lib/domain/schedule-health) as a list of findings, each naming its
// activities. Findings never stop a run: the words say so.
import type { HealthFinding, HealthRule } from '@/lib/domain/schedule-health';

const TITLES: Record<HealthRule, string> = {
  'open-start': 'Open start',
  'open-finish': 'Open finish',
  'dangling-start': 'Dangling start',
  'dangling-finish': 'Dangling finish',
  lead: 'Lead',
  'long-lag': 'Long lag',
  'long-activity': 'Long activity',
  'degenerate-critical': 'No range on the critical path',
  'no-uncertainty': 'Activities without uncertainty',
};

export function HealthFindings({
  findings,
  activityCount,
  context,
}: {
  findings: HealthFinding[];
  activityCount: number;
  /** Where it is shown: the schedule tab, or the run form (where the run can still start). */
  context: 'schedule' | 'run';
}) {
  const heading =
    context === 'run' ? "The schedule's health check before this run" : 'Health check of the network';
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
              <span className="font-medium">{TITLES[f.rule]}:</span> {f.message}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="mt-1 text-xs text-ink-soft">
        {context === 'run'
          ? 'The run can go ahead with these findings; its results are only as sound as the network.'
          : 'Common checks of schedule logic; a run can go ahead with findings, but its results are only as sound as the network.'}
      </p>
    </section>
  );
}
