import Link from 'next/link';
import { can } from '@/lib/auth/roles';
import { isAppError } from '@/lib/errors';
import { loadOrNotFound } from '@/lib/http/page';
import { getBrief } from '@/lib/services/brief';
import type { BriefData } from '@/lib/brief/build';
import { dateTimeText, moneyWithInterval } from '@/lib/brief/format';
import { headlineSentences } from '@/lib/brief/headline';
import { selfApprovalRefusal } from '@/lib/brief/wording';
import { formatDays, formatMoneyShort } from '@/lib/runs/format';
import { selfApprovalAllowed } from '@/lib/services/organization-settings';
import { buttonClass } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import { Notice, ResultCautions } from '@/components/ui/notice';
import { AllocationTable } from '@/components/brief/allocation-table';
import { ClassCheckPanel } from '@/components/brief/class-check';
import { FinishSection } from '@/components/brief/finish-section';
import { HealthFindings } from '@/components/schedule/health-findings';
import { ScenarioPanel } from '@/components/brief/scenario-panel';
import { DecisionPanel } from '@/components/brief/decision-panel';
import { DecisionRecord } from '@/components/brief/decision-record';
import {
  HeadlineFigures,
  PercentileTable,
  TargetsTable,
  daysOf,
  moneyOf,
  p80Of,
} from '@/components/brief/figures';
import { NotesEditor } from '@/components/brief/notes-editor';
import { PrintButton } from '@/components/brief/print-button';
import { RiskTable } from '@/components/brief/risk-table';
import { SCurveSvg, type CurveMarker } from '@/components/brief/s-curve-svg';
import { SendToSponsors } from '@/components/brief/send-to-sponsors';
import { TornadoSvg } from '@/components/brief/tornado-svg';

import { loadRunPage, type RunParams } from '../run-page';

const DRIVERS_CAPTION = (total: string) =>
  `Rank correlation of each input with ${total}, every kind of input: the longer the bar, the more that input drives the spread and the more its mitigation is worth. On the right, the mean total when the input is in its lowest and in its highest tenth.`;

function Section({ title, children, id }: { title: string; children: React.ReactNode; id?: string }) {
  return (
    <section className="brief-section space-y-2" aria-labelledby={id}>
      <h2
        id={id}
        className="border-b border-rule pb-1 text-sm font-semibold uppercase tracking-wide text-ink-soft"
      >
        {title}
      </h2>
      {children}
    </section>
  );
}

/** The headline: what funding at the level buys in cost and time, against both targets. */
function Headline({ brief }: { brief: BriefData }) {
  return (
    <p className="text-lg" data-testid="headline">
      {headlineSentences(brief).join(' ')}
    </p>
  );
}

export default async function BriefPage({ params }: { params: RunParams }) {
  const { actor, ...found } = await loadRunPage(params, 'brief', 'brief:read');
  let brief: BriefData;
  try {
    brief = await loadOrNotFound(() => getBrief(actor, found.project.id, found.run.id));
  } catch (e) {
    if (isAppError(e) && e.status === 409)
      return (
        <EmptyState title="The brief is not ready">
          <p>{e.message} A brief is made from a run that has succeeded.</p>
          <p className="mt-3">
            <Link className="text-cost underline" href={`/projects/${found.project.id}/runs/${found.run.id}`}>
              Open the run
            </Link>
          </p>
        </EmptyState>
      );
    throw e;
  }
  const { project, run } = brief;
  const money = moneyOf(brief);
  const p80 = p80Of(brief);
  const pdfUrl = `/api/projects/${project.id}/brief/${run.id}/pdf`;
  const costMarkers: CurveMarker[] = [
    { label: 'Base', value: brief.cost.base, tone: 'base' },
    { label: brief.contingency.level, value: brief.contingency.value, tone: 'level' },
  ];
  if (brief.cost.target)
    costMarkers.push({ label: 'Target', value: brief.cost.target.value, tone: 'target' });
  const mayDecide = can(actor.role, 'baseline:decide');
  // Separation of duties: whoever started the run may return it, but approves it only where allowed.
  const ownRun = brief.run.startedById === actor.userId;
  const mayApprove = mayDecide && (!ownRun || (await selfApprovalAllowed(actor.organizationId)));
  const mayEdit = can(actor.role, 'project:write');

  return (
    <article className="brief mx-auto max-w-[980px] space-y-5" aria-label={`Brief of run ${run.number}`}>
      <nav className="no-print flex flex-wrap items-center gap-2 text-sm" aria-label="Brief actions">
        <Link href={`/projects/${project.id}/runs/${run.id}`} className="text-cost underline">
          ← Run {run.number}
        </Link>
        <span className="ml-auto" />
        <PrintButton />
        <a className={buttonClass('secondary')} href={pdfUrl} download>
          Download PDF (A4)
        </a>
        <a className={buttonClass('ghost')} href={`${pdfUrl}?paper=letter`} download>
          PDF (Letter)
        </a>
      </nav>

      <header className="space-y-1">
        <p className="text-sm text-ink-faint">
          Brief for sponsors · {project.code} · run {run.number}
        </p>
        {/* The workspace layout holds the page's h1; the brief's own title is what prints. */}
        <h2 className="text-2xl font-semibold" data-testid="brief-title">
          {project.name}
        </h2>
        <p className="text-ink-soft">
          {project.stage} · Class {project.estimateClass} estimate · {project.currency} · run by{' '}
          {run.startedByName ?? 'a former member'}
          {run.finishedAt ? `, ${dateTimeText(run.finishedAt)}` : ''}
        </p>
      </header>

      <Headline brief={brief} />
      <HeadlineFigures brief={brief} />
      <ScenarioPanel brief={brief} />

      {brief.decision ? <DecisionRecord decision={brief.decision} /> : null}
      {!brief.decision && (mayDecide || mayEdit) ? (
        <div className="no-print grid grid-cols-2 gap-4 rounded border border-rule bg-paper-raised p-4">
          {mayDecide ? (
            <div>
              <h2 className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-soft">Decide</h2>
              <DecisionPanel
                projectId={project.id}
                runId={run.id}
                levelText={`${brief.contingency.level}, ${money(brief.contingency.value)}`}
                approveRefusal={mayApprove ? null : selfApprovalRefusal(run.number)}
                selfApproval={mayApprove && ownRun}
              />
            </div>
          ) : null}
          {mayEdit ? (
            <div>
              <h2 className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-soft">
                Put forward
              </h2>
              <p className="mb-2 text-sm text-ink-soft">
                E-mails the organisation&apos;s sponsors a link to this brief so that they can approve it or
                return it.
              </p>
              <SendToSponsors
                projectId={project.id}
                runId={run.id}
                sentText={
                  brief.sentForDecision
                    ? `Last sent by ${brief.sentForDecision.byName}, ${dateTimeText(brief.sentForDecision.at)}.`
                    : null
                }
              />
            </div>
          ) : null}
        </div>
      ) : null}
      {!brief.decision && !mayDecide && !mayEdit ? (
        <Notice>This run awaits a sponsor&apos;s decision.</Notice>
      ) : null}

      <div className="grid grid-cols-2 gap-5 brief-columns">
        <Section title="Confidence levels of total cost">
          <PercentileTable total={brief.cost} show={money} caption={`Total cost in ${project.currency}`} />
        </Section>
        {brief.duration ? (
          <Section title="Confidence levels of duration">
            <PercentileTable
              total={brief.duration}
              show={daysOf}
              caption="Project duration in working days (wd)"
            />
          </Section>
        ) : null}
      </div>

      <Section title="Probability of meeting the targets">
        <TargetsTable brief={brief} />
      </Section>

      {brief.finish ? (
        <Section title="Finish dates">
          <FinishSection brief={brief} />
          <HealthFindings
            findings={brief.scheduleHealth.findings}
            activityCount={brief.scheduleHealth.activityCount}
            context="brief"
          />
        </Section>
      ) : null}

      {brief.classCheck ? (
        <Section title={`Estimate-class check (Class ${brief.classCheck.estimateClass})`}>
          <ClassCheckPanel check={brief.classCheck} currency={project.currency} />
        </Section>
      ) : null}

      <Section title="Cost S-curve">
        <SCurveSvg
          testId="cost-s-curve"
          curve={brief.cost.curve}
          markers={costMarkers}
          tickText={(v) => formatMoneyShort(v, project.currency)}
          label={`S-curve of total cost: ${brief.contingency.level} is ${money(brief.contingency.value)}`}
          caption={
            <>
              Share of simulated outcomes (vertical) at or below each total cost in {project.currency}{' '}
              (horizontal). {brief.contingency.level.slice(1)} % of outcomes cost at most{' '}
              {money(brief.contingency.value)}.
            </>
          }
        />
      </Section>

      {brief.allocation ? (
        <Section title="Where the contingency sits (by top-level WBS)">
          <AllocationTable allocation={brief.allocation} currency={project.currency} />
        </Section>
      ) : null}

      <Section title="Top drivers of cost">
        <TornadoSvg
          testId="cost-drivers"
          drivers={brief.drivers}
          label="Top drivers of total cost"
          caption={DRIVERS_CAPTION('total cost')}
          swingText={(v) => formatMoneyShort(v, project.currency)}
        />
      </Section>

      {brief.duration ? (
        <Section title="Top drivers of finish">
          <TornadoSvg
            testId="finish-drivers"
            drivers={brief.finishDrivers}
            label="Top drivers of the project's duration"
            caption={DRIVERS_CAPTION('the project duration')}
            swingText={(v) => formatDays(v, 0)}
          />
        </Section>
      ) : null}

      <Section
        title={`Top risk events by expected cost${brief.scenario.used === 'post' ? ', after the responses' : ''}`}
      >
        <RiskTable risks={brief.topRisks} currency={project.currency} />
      </Section>

      <div className="grid grid-cols-2 gap-5 brief-columns">
        <Section title="Assumptions">
          <p
            className={`whitespace-pre-line text-sm ${project.assumptions ? '' : 'text-ink-faint'}`}
            data-testid="assumptions"
          >
            {project.assumptions ?? 'None stated.'}
          </p>
        </Section>
        <Section title="Exclusions">
          <p
            className={`whitespace-pre-line text-sm ${project.exclusions ? '' : 'text-ink-faint'}`}
            data-testid="exclusions"
          >
            {project.exclusions ?? 'None stated.'}
          </p>
        </Section>
      </div>
      {mayEdit ? (
        <div className="no-print">
          <NotesEditor
            projectId={project.id}
            initial={{
              assumptions: project.assumptions,
              exclusions: project.exclusions,
              version: project.version,
            }}
          />
        </div>
      ) : null}

      <Section title="The run">
        <dl className="grid grid-cols-[12rem_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-ink-soft">Run by</dt>
          <dd>{run.startedByName ?? 'a former member'}</dd>
          <dt className="text-ink-soft">Started</dt>
          <dd>{run.startedAt ? dateTimeText(run.startedAt) : '—'}</dd>
          <dt className="text-ink-soft">Finished</dt>
          <dd>{run.finishedAt ? dateTimeText(run.finishedAt) : '—'}</dd>
          <dt className="text-ink-soft">Iterations</dt>
          <dd>
            {run.iterations.toLocaleString('en-GB')} (
            {run.sampling === 'lhs' ? 'Latin hypercube' : 'Monte Carlo'}, seed {run.seed})
          </dd>
          <dt className="text-ink-soft">Input hash (SHA-256)</dt>
          <dd className="break-all font-mono text-xs" data-testid="input-hash">
            {run.inputHash}
          </dd>
          <dt className="text-ink-soft">Cost P80</dt>
          <dd data-testid="p80-text">{moneyWithInterval(p80.value, p80.ci95, project.currency)}</dd>
        </dl>
      </Section>

      {brief.engineWarnings.map((w) => (
        <Notice key={w} tone="caution" title="Engine warning">
          {w}
        </Notice>
      ))}
      <ResultCautions />
    </article>
  );
}
