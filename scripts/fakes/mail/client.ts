// Reads the local fake SMTP server's JSON API (scripts/fakes/mail.ts), for tests that need
// the mail a person would receive: "wait for the reset link sent to ana@…".

export type CaughtMail = {
  id: number;
  receivedAt: string;
  envelope: { from: string; to: string[] };
  kind: string | null;
  subject: string;
  from: string;
  to: string[];
  text: string;
  html: string;
  headers: Record<string, string>;
};

export const mailApiUrl = () => `http://127.0.0.1:${process.env.MAIL_UI_PORT ?? 2580}`;

/** Every caught mail sent to this address (newest first). */
export async function mailTo(address: string): Promise<CaughtMail[]> {
  const res = await fetch(`${mailApiUrl()}/api/messages?to=${encodeURIComponent(address)}`);
  if (!res.ok) throw new Error(`The mail fake answered ${res.status}`);
  return ((await res.json()) as { messages: CaughtMail[] }).messages;
}

/** Waits until a mail (optionally of one kind) reaches the address, or fails after `timeoutMs`. */
export async function waitForMail(
  address: string,
  { kind, timeoutMs = 20_000, count = 1 }: { kind?: string; timeoutMs?: number; count?: number } = {},
): Promise<CaughtMail[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await mailTo(address)).filter((m) => !kind || m.kind === kind);
    if (found.length >= count) return found;
    if (Date.now() > deadline)
      throw new Error(`No ${kind ?? ''} mail to ${address} after ${timeoutMs} ms (found ${found.length})`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** The first link in a mail's text body that starts with `prefix` (e.g. APP_URL + '/reset-password/'). */
export function linkIn(mail: CaughtMail, prefix: string): string {
  const escaped = prefix.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const match = new RegExp(`${escaped}[^\\s<>"]*`).exec(mail.text);
  if (!match) throw new Error(`No link starting with ${prefix} in "${mail.subject}"`);
  return match[0];
}
