import { renderMessage, type RenderedMail } from '../layout';
import { appUrl, runBriefPath } from '../links';

export type BaselineDecisionMail = {
  projectId: number;
  projectName: string;
  runId: number;
  /** The run's number within its project, the name the mail reads. */
  runNumber: number;
  decision: 'approved' | 'returned';
  decidedByName: string;
  comment: string;
  p80Text?: string;
};

export function baselineDecisionMail(d: BaselineDecisionMail): RenderedMail {
  const approved = d.decision === 'approved';
  const facts: [string, string][] = [['Project', d.projectName]];
  if (d.p80Text) facts.push(['Cost P80', d.p80Text]);
  return renderMessage({
    subject: approved
      ? `Baseline approved: ${d.projectName}, run ${d.runNumber}`
      : `Returned for rework: ${d.projectName}, run ${d.runNumber}`,
    heading: approved ? 'The baseline is approved' : 'The run was returned',
    paragraphs: [
      approved
        ? `${d.decidedByName} approved run ${d.runNumber} as the baseline of ${d.projectName}. The project’s trend now includes it.`
        : `${d.decidedByName} returned run ${d.runNumber} of ${d.projectName} without approving it. The project keeps its current baseline.`,
    ],
    facts,
    quote: d.comment.trim() ? { label: `${d.decidedByName} wrote:`, text: d.comment.trim() } : undefined,
    action: { label: 'Open the brief', url: appUrl(runBriefPath(d.projectId, d.runId)) },
    optional: true,
  });
}
