// Turns one message's content into its HTML and plain-text bodies. Templates give plain
// strings only; everything is escaped here, so a project name or a sponsor's comment can
// never inject markup into a mail.
import { appUrl, notificationSettingsPath } from './links';

export type MessageContent = {
  subject: string;
  heading: string;
  paragraphs: string[];
  /** Label and value pairs shown as a small table, e.g. the P80 of a run. */
  facts?: [string, string][];
  /** A quoted block, e.g. the sponsor's comment. */
  quote?: { label: string; text: string };
  action: { label: string; url: string };
  /** Small print under the button, e.g. when the link expires. */
  note?: string;
  /** Optional notices say where to turn them off; asked-for mail does not. */
  optional: boolean;
};

export type RenderedMail = { subject: string; html: string; text: string };

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

// Inline styles only: most mail readers ignore style sheets. Colours are the app's paper and ink.
const INK = '#1d2430';
const SOFT = '#4a5261';
const RULE = '#d9d3c5';
const ACCENT = '#16607a';

function htmlBody(c: MessageContent): string {
  const p = (text: string) =>
    `<p style="margin:0 0 12px;font-size:15px;line-height:1.5;color:${INK}">${escapeHtml(text)}</p>`;
  const facts = c.facts?.length
    ? `<table role="presentation" style="border-collapse:collapse;margin:4px 0 16px;font-size:14px">${c.facts
        .map(
          ([label, value]) =>
            `<tr><td style="padding:3px 16px 3px 0;color:${SOFT}">${escapeHtml(label)}</td>` +
            `<td style="padding:3px 0;color:${INK};font-variant-numeric:tabular-nums;text-align:right">${escapeHtml(value)}</td></tr>`,
        )
        .join('')}</table>`
    : '';
  const quote = c.quote
    ? `<p style="margin:0 0 4px;font-size:13px;color:${SOFT}">${escapeHtml(c.quote.label)}</p>` +
      `<blockquote style="margin:0 0 16px;padding:8px 12px;border-left:3px solid ${RULE};color:${INK};white-space:pre-wrap">${escapeHtml(c.quote.text)}</blockquote>`
    : '';
  const url = escapeHtml(c.action.url);
  const note = c.note
    ? `<p style="margin:0 0 12px;font-size:13px;color:${SOFT}">${escapeHtml(c.note)}</p>`
    : '';
  const footer = c.optional
    ? `You receive this notice as a member of an Outturn organisation. Turn it off in <a href="${escapeHtml(appUrl(notificationSettingsPath))}" style="color:${SOFT}">your notice settings</a>.`
    : 'You receive this e-mail because it was asked for in Outturn. If you did not expect it, you can ignore it.';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(c.subject)}</title></head>
<body style="margin:0;padding:24px;background:#f8f6f1;font-family:Inter,Segoe UI,Helvetica,Arial,sans-serif">
<div style="max-width:560px;margin:0 auto;background:#fffdf8;border:1px solid ${RULE};border-radius:4px;padding:24px">
<p style="margin:0 0 16px;font-weight:600;color:${ACCENT}">Outturn</p>
<h1 style="margin:0 0 12px;font-size:19px;color:${INK}">${escapeHtml(c.heading)}</h1>
${c.paragraphs.map(p).join('\n')}
${facts}${quote}
<p style="margin:8px 0 16px"><a href="${url}" style="display:inline-block;background:${ACCENT};color:#fffdf8;text-decoration:none;padding:8px 14px;border-radius:4px;font-size:14px">${escapeHtml(c.action.label)}</a></p>
<p style="margin:0 0 12px;font-size:13px;color:${SOFT}">Or open this address: <a href="${url}" style="color:${ACCENT}">${url}</a></p>
${note}
<hr style="border:none;border-top:1px solid ${RULE};margin:16px 0">
<p style="margin:0;font-size:12px;color:${SOFT}">${footer}</p>
</div></body></html>`;
}

function textBody(c: MessageContent): string {
  const lines = [c.heading, '', ...c.paragraphs.flatMap((p) => [p, ''])];
  if (c.facts?.length) {
    const width = Math.max(...c.facts.map(([label]) => label.length));
    for (const [label, value] of c.facts) lines.push(`  ${label.padEnd(width)}  ${value}`);
    lines.push('');
  }
  if (c.quote) lines.push(`${c.quote.label}`, ...c.quote.text.split('\n').map((l) => `> ${l}`), '');
  lines.push(`${c.action.label}: ${c.action.url}`, '');
  if (c.note) lines.push(c.note, '');
  lines.push('--');
  lines.push(
    c.optional
      ? `Turn this notice off in your notice settings: ${appUrl(notificationSettingsPath)}`
      : 'You receive this e-mail because it was asked for in Outturn. If you did not expect it, you can ignore it.',
  );
  return lines.join('\n');
}

export function renderMessage(content: MessageContent): RenderedMail {
  return { subject: content.subject, html: htmlBody(content), text: textBody(content) };
}
