// Absolute links for e-mails: a mail is read outside the app, so every link carries APP_URL.

export function appUrl(path: string): string {
  const base = (process.env.APP_URL ?? 'http://localhost:3000').replace(/\/+$/, '');
  return `${base}${path.startsWith('/') ? path : `/${path}`}`;
}

export const runOutcomePath = (projectId: number, runId: number) => `/projects/${projectId}/runs/${runId}`;
export const runBriefPath = (projectId: number, runId: number) =>
  `/projects/${projectId}/runs/${runId}/brief`;
export const notificationSettingsPath = '/settings/notifications';
