import 'server-only';
// Delivering the outbox: each due row is claimed, sent over SMTP and marked sent; a failed
// send stays pending with its error and is tried again later with a growing delay, so an
// SMTP outage delays mail but never loses it.
import { Op } from 'sequelize';
import type { Transporter } from 'nodemailer';
import { OutboundMessage } from '@/models';
import { componentLogger } from '@/lib/log';
import { createMailTransport, mailFrom } from './transport';
import { MAX_ATTEMPTS, retryDelayMs } from './retry';

/** A claimed row is not picked again for this long, even if its sender died mid-send. */
const CLAIM_MS = 2 * 60_000;
const BATCH = 25;
const POLL_MS = 2_000;

const mailLog = componentLogger('mail');

export type DeliveryOptions = {
  /** The clock, for tests; defaults to the real time. */
  now?: Date;
  /** Defaults to SMTP_HOST:SMTP_PORT. */
  transport?: Transporter;
  /** Only these rows, for tests. */
  ids?: number[];
  /** Stops before the next row once aborted (the server is shutting down). */
  signal?: AbortSignal;
};

export type DeliveryReport = { sent: number; retrying: number; failed: number };

async function claim(id: number, now: Date): Promise<boolean> {
  // Conditional update: of two senders racing for one row (two web instances, or two batches of
  // one) only one sees it still due; the database's row lock decides, so this holds across
  // machines too, as long as their clocks agree to well within CLAIM_MS.
  const [changed] = await OutboundMessage.update(
    { nextAttemptAt: new Date(now.getTime() + CLAIM_MS) },
    { where: { id, status: 'pending', nextAttemptAt: { [Op.lte]: now } } },
  );
  return changed === 1;
}

async function deliverOne(row: OutboundMessage, transport: Transporter, now: Date) {
  const attempts = row.attempts + 1;
  try {
    await transport.sendMail({
      from: mailFrom(),
      to: row.toAddress,
      subject: row.subject,
      text: row.text,
      html: row.html,
      headers: { 'X-Outturn-Kind': row.kind, 'X-Outturn-Message': String(row.id) },
    });
    await row.update({ status: 'sent', attempts, sentAt: new Date(), lastError: null });
    mailLog.info({ messageId: row.id, kind: row.kind, attempts }, 'mail sent');
    return 'sent' as const;
  } catch (error) {
    const lastError = (error instanceof Error ? error.message : String(error)).slice(0, 1000);
    const giveUp = attempts >= MAX_ATTEMPTS;
    await row.update({
      attempts,
      lastError,
      status: giveUp ? 'failed' : 'pending',
      nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)),
    });
    mailLog.warn(
      { messageId: row.id, kind: row.kind, attempts, reason: lastError },
      giveUp ? 'mail not sent: no attempts left' : 'mail not sent: trying again later',
    );
    return giveUp ? ('failed' as const) : ('retrying' as const);
  }
}

/** Sends every pending mail that is due. Safe to run in several processes at once. */
export async function deliverPending(options: DeliveryOptions = {}): Promise<DeliveryReport> {
  const now = options.now ?? new Date();
  const report: DeliveryReport = { sent: 0, retrying: 0, failed: 0 };
  const due = await OutboundMessage.findAll({
    where: {
      status: 'pending',
      nextAttemptAt: { [Op.lte]: now },
      ...(options.ids ? { id: { [Op.in]: options.ids } } : {}),
    },
    order: [['nextAttemptAt', 'ASC']],
    limit: BATCH,
  });
  if (!due.length) return report;
  const transport = options.transport ?? createMailTransport();
  try {
    for (const row of due) {
      if (options.signal?.aborted) break;
      if (!(await claim(row.id, now))) continue;
      report[await deliverOne(row, transport, now)] += 1;
    }
  } finally {
    if (!options.transport) transport.close();
  }
  return report;
}

// The background sender of this server process. Kept on globalThis: Next.js may load this
// module in more than one bundle of one process, and there must be one timer.
type SenderState = {
  started: boolean;
  running: boolean;
  again: boolean;
  timer?: NodeJS.Timeout;
  /** The batch being delivered, for a shutdown to wait on. */
  current?: Promise<void>;
  stop?: AbortController;
};
const state = ((globalThis as unknown as { outturnMailSender?: SenderState }).outturnMailSender ??= {
  started: false,
  running: false,
  again: false,
});

async function deliverUntilIdle(signal: AbortSignal) {
  try {
    do {
      state.again = false;
      await deliverPending({ signal });
    } while (state.again && !signal.aborted);
  } catch (error) {
    // The database may be briefly away; the next poll tries again.
    mailLog.error({ reason: error instanceof Error ? error.message : String(error) }, 'outbox not delivered');
  } finally {
    state.running = false;
    state.current = undefined;
  }
}

function runOnce() {
  if (!state.started || !state.stop) return;
  if (state.running) {
    state.again = true;
    return;
  }
  state.running = true;
  state.current = deliverUntilIdle(state.stop.signal);
}

/** Starts polling the outbox every couple of seconds (called once from instrumentation.ts). */
export function startMailSender(): void {
  if (state.started) return;
  state.started = true;
  state.stop = new AbortController();
  state.timer = setInterval(runOnce, POLL_MS);
  state.timer.unref();
  runOnce();
}

/**
 * Stops polling and waits (up to `waitMs`) for the mail being sent to be marked: a mail cut off
 * between the SMTP server's acceptance and that mark would be sent again once its claim expires.
 */
export async function stopMailSender(waitMs = 5_000): Promise<void> {
  if (!state.started) return;
  state.started = false;
  clearInterval(state.timer);
  state.stop?.abort();
  if (state.current) {
    let timer: NodeJS.Timeout | undefined;
    const timeout = new Promise<void>((resolve) => (timer = setTimeout(resolve, waitMs)));
    await Promise.race([state.current, timeout]);
    clearTimeout(timer);
  }
}

/** Delivers soon without waiting for the next poll; does nothing where no sender runs. */
export function kickMailSender(): void {
  if (state.started) setImmediate(runOnce);
}
