import { renderMessage, type RenderedMail } from '../layout';
import { appUrl, runBriefPath } from '../links';

export type BriefReadyMail = {
  projectId: number;
  projectName: string;
  runId: number;
  /** The run's number within its project, the name the mail reads. */
  runNumber: number;
  /** e.g. "EUR 25,340,000 (95% interval 25,100,000 – 25,590,000)". */
  p80Text: string;
  /** Who put the brief forward. */
  preparedByName: string;
};

export function briefReadyMail(d: BriefReadyMail): RenderedMail {
  return renderMessage({
    subject: `A brief for ${d.projectName} awaits your decision`,
    heading: 'A brief awaits your decision',
    paragraphs: [
      `${d.preparedByName} has put the brief of run ${d.runNumber} of ${d.projectName} forward for a decision.`,
      'Read it, then approve the run as the project’s baseline or return it with a comment.',
    ],
    facts: [
      ['Project', d.projectName],
      ['Cost P80', d.p80Text],
    ],
    action: { label: 'Read the brief', url: appUrl(runBriefPath(d.projectId, d.runId)) },
    note: 'The figures support, and do not replace, professional judgement, your organisation’s contingency policy and the funding body’s rules.',
    optional: true,
  });
}
