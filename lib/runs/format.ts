// Figures for the run screens. Every format lives in lib/format, the one place for figures;
// this module keeps the names the run screens use and adds the time left of a run.
export {
  formatChange,
  formatCount,
  formatDate,
  formatDateTime,
  formatDays,
  formatInterval,
  formatMoney,
  formatMoneyShort,
  formatNumber,
  formatPercent,
  formatPercent as formatShare,
  formatSignedPercent,
} from '@/lib/format';

/** "about 12 s", "about 3 min": the remaining time of a run, rounded as a person would say it. */
export function formatTimeLeft(ms: number): string {
  if (!Number.isFinite(ms) || ms < 0) return 'estimating…';
  const s = Math.ceil(ms / 1000);
  if (s < 60) return `about ${s} s`;
  const m = Math.round(s / 60);
  if (m < 60) return `about ${m} min`;
  return `about ${Math.floor(m / 60)} h ${m % 60} min`;
}
