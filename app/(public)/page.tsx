import Link from 'next/link';
import { buttonClass } from '@/components/ui/button';

const STEPS = [
  {
    title: 'Enter the ranges',
    text: 'Line items with three-point or lognormal ranges, a risk register with probabilities and impacts, and the schedule network — in grids that behave like a spreadsheet.',
  },
  {
    title: 'Say what moves together',
    text: 'Correlate items, durations and risk impacts. Outturn checks the coefficients are consistent and shows any repair it had to make.',
  },
  {
    title: 'Read the confidence levels',
    text: 'A Monte Carlo run gives P10 to P90 for cost and finish, each with its interval, the contingency over the base, and a tornado of what drives the spread.',
  },
  {
    title: 'Decide and track',
    text: 'Sponsors read a short brief and approve a baseline; the trend shows contingency drawing down gate by gate as risks are retired.',
  },
];

export default function LandingPage() {
  return (
    <div className="mx-auto max-w-6xl px-6 py-14">
      <section className="max-w-3xl">
        <p className="text-sm font-semibold uppercase tracking-widest text-cost">
          Cost and schedule risk, with confidence levels
        </p>
        <h1 className="mt-3 text-3xl font-semibold tracking-tight">
          Forecast what a capital project will finally cost, and when it will finish — honestly.
        </h1>
        <p className="mt-4 text-lg text-ink-soft">
          Outturn is for cost estimators, project-controls engineers and risk managers who must set a
          defensible contingency and a realistic completion date before sanction, and keep both honest at
          every stage gate. Instead of a single number, it answers with P50 and P80 figures that a sponsor can
          fund against.
        </p>
        <div className="mt-6 flex gap-3">
          <Link href="/sign-up" className={buttonClass('primary', 'px-4 py-2 text-base')}>
            Start a 14-day trial
          </Link>
          <Link href="/sign-in" className={buttonClass('secondary', 'px-4 py-2 text-base')}>
            Sign in
          </Link>
        </div>
      </section>

      <section className="mt-14 grid gap-4 md:grid-cols-4" aria-label="How it works">
        {STEPS.map((step, i) => (
          <article key={step.title} className="rounded border border-rule bg-paper-raised p-4">
            <p className="num text-left text-sm font-semibold text-time">{String(i + 1).padStart(2, '0')}</p>
            <h2 className="mt-1 font-semibold">{step.title}</h2>
            <p className="mt-2 text-sm text-ink-soft">{step.text}</p>
          </article>
        ))}
      </section>

      <section className="mt-10 grid gap-4 md:grid-cols-3 text-sm">
        <div>
          <h2 className="font-semibold">Estimators</h2>
          <p className="text-ink-soft">Build the model, run it, and explain the spread.</p>
        </div>
        <div>
          <h2 className="font-semibold">Sponsors</h2>
          <p className="text-ink-soft">Read the brief, see the intervals, approve a baseline.</p>
        </div>
        <div>
          <h2 className="font-semibold">Billing admins</h2>
          <p className="text-ink-soft">Manage paid seats; sponsors and billing members are free.</p>
        </div>
      </section>

      <p className="mt-12 max-w-3xl border-t border-rule pt-4 text-xs text-ink-faint">
        Results are only as good as the ranges entered. They support, and do not replace, professional
        judgement, your organisation&apos;s contingency policy and the funding body&apos;s rules.
      </p>
    </div>
  );
}
