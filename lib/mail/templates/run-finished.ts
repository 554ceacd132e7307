import { renderMessage, type RenderedMail } from '../layout';
import { appUrl, runOutcomePath } from '../links';

export type RunFinishedMail = {
  projectId: number;
  projectName: string;
  runId: number;
  /** The run's number within its project, the name the mail reads. */
  runNumber: number;
  outcome: 'succeeded' | 'failed' | 'cancelled';
  /** The run's P80 of cost as the app shows it, e.g. "EUR 25,340,000"; only for a run that succeeded. */
  p80Text?: string;
  /** e.g. "10,000 iterations, LHS, seed 1". */
  settingsText?: string;
  /** Why a run failed, in words a member can act on. */
  failureText?: string;
};

const HEADINGS: Record<RunFinishedMail['outcome'], string> = {
  succeeded: 'Your run has finished',
  failed: 'Your run did not finish',
  cancelled: 'Your run was cancelled',
};

export function runFinishedMail(d: RunFinishedMail): RenderedMail {
  const facts: [string, string][] = [['Project', d.projectName]];
  if (d.settingsText) facts.push(['Settings', d.settingsText]);
  if (d.outcome === 'succeeded' && d.p80Text) facts.push(['Cost P80', d.p80Text]);
  const paragraphs =
    d.outcome === 'succeeded'
      ? [`Run ${d.runNumber} of ${d.projectName} has finished. Its outcome is ready to read.`]
      : d.outcome === 'failed'
        ? [
            `Run ${d.runNumber} of ${d.projectName} stopped before it finished.`,
            ...(d.failureText ? [d.failureText] : []),
          ]
        : [`Run ${d.runNumber} of ${d.projectName} was cancelled before it finished; it has no outcome.`];
  return renderMessage({
    subject: `${HEADINGS[d.outcome]}: ${d.projectName}`,
    heading: HEADINGS[d.outcome],
    paragraphs,
    facts,
    action: {
      label: d.outcome === 'succeeded' ? 'Read the outcome' : 'Open the run',
      url: appUrl(runOutcomePath(d.projectId, d.runId)),
    },
    note:
      d.outcome === 'succeeded'
        ? 'Simulated results are only as good as the ranges entered; read them with professional judgement.'
        : undefined,
    optional: true,
  });
}
