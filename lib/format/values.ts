// Values of the model file and of register rows as people read them, for the lists of changes
// (the audit trail, the comparison of two runs): never raw JSON. A distribution reads
// "PERT 3,800,000 / 4,200,000 / 5,400,000", a probability "30.0 %", a list "A1, A2 (lag 5)".
import { DIST_LABELS } from '@/lib/registers/dist-fields';
import { formatNumber, formatPercent } from './numbers';

export type ValueKind = 'money' | 'days' | 'percent' | 'number' | 'text';

const num = (v: unknown, kind: ValueKind) =>
  typeof v === 'number' ? (kind === 'percent' ? formatPercent(v) : formatNumber(v, 2)) : '—';

/** A distribution of the model file: "Triangular 80 / 100 / 150", "Normal mean 100, sd 10". */
export function distText(dist: Record<string, unknown>, kind: ValueKind = 'number'): string {
  const name = DIST_LABELS[dist.type as keyof typeof DIST_LABELS] ?? String(dist.type);
  const n = (k: string) => num(dist[k], kind);
  const range = dist.range === 'p10-p90' ? ' (P10–P90)' : '';
  switch (dist.type) {
    case 'fixed':
      return `${name} ${n('value')}`;
    case 'uniform':
      return `${name} ${n('low')} – ${n('high')}${range}`;
    case 'triangular':
    case 'pert':
      return `${name} ${n('low')} / ${n('mode')} / ${n('high')}${range}`;
    case 'normal':
      return `${name} mean ${n('mean')}, sd ${n('sd')}`;
    case 'lognormal':
      return 'p10' in dist
        ? `${name} P10 ${n('p10')}, P90 ${n('p90')}`
        : `${name} mean ${n('mean')}, sd ${n('sd')}`;
    default:
      return name;
  }
}

const isDist = (v: object): v is Record<string, unknown> =>
  'type' in v && typeof (v as { type: unknown }).type === 'string';

/** Words for a field name: "mitigationCost" → "mitigation cost", "aCode" → "a code". */
export function fieldWords(field: string): string {
  return field
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase();
}

/** Any value of a model file or register row as a short text, objects and lists included. */
export function valueText(value: unknown, kind: ValueKind = 'text'): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'number') return kind === 'text' ? formatNumber(value, 4) : num(value, kind);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'string') return value;
  if (Array.isArray(value)) {
    if (value.length === 0) return 'none';
    return value.map((v) => linkText(v, kind)).join(', ');
  }
  if (typeof value === 'object') {
    if (isDist(value)) return distText(value, kind);
    const parts = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== null && v !== undefined)
      .map(([k, v]) => `${fieldWords(k)} ${valueText(v, kind)}`);
    return parts.length ? parts.join('; ') : '—';
  }
  return String(value);
}

/** An element of a list: a code, or a link with its lag ("A1 (lag 5)"). */
function linkText(v: unknown, kind: ValueKind): string {
  if (v && typeof v === 'object' && 'id' in v) {
    const link = v as { id: unknown; lag?: unknown; type?: unknown };
    const extras = [
      link.type && link.type !== 'FS' ? String(link.type) : '',
      link.lag ? `lag ${link.lag}` : '',
    ]
      .filter(Boolean)
      .join(', ');
    return extras ? `${String(link.id)} (${extras})` : String(link.id);
  }
  return valueText(v, kind);
}
