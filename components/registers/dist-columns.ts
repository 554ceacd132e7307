// Columns for a distribution held in flat cells (type, range, low, most likely, high, mean, sd).
import {
  DIST_LABELS,
  DIST_TYPES,
  partApplies,
  type DistPart,
  type DistType,
} from '@/lib/registers/dist-fields';
import type { RegisterColumn } from '@/components/grid/columns';
import type { GridRow } from '@/components/grid/use-register-rows';

const uses = (part: DistPart) => (row: GridRow) => {
  const type = row.distType as DistType | null;
  // A lognormal takes low/high (P10/P90) or mean/SD.
  return !!type && DIST_TYPES.includes(type) && partApplies(type, part);
};

export function distColumns(options: { allowNone?: boolean; unit?: string } = {}): RegisterColumn[] {
  const unit = options.unit ? ` (${options.unit})` : '';
  return [
    {
      field: 'distType',
      header: 'Distribution',
      kind: 'choice',
      width: 112,
      options: [
        ...(options.allowNone ? [{ value: null, label: '— (base only)' }] : []),
        ...DIST_TYPES.map((t) => ({ value: t, label: DIST_LABELS[t] })),
      ],
    },
    {
      field: 'range',
      header: 'Low/high are',
      kind: 'choice',
      width: 104,
      headerTooltip:
        'For triangular and PERT: whether low and high are the absolute bounds or the P10 and P90',
      options: [
        { value: 'min-max', label: 'Min–max' },
        { value: 'p10-p90', label: 'P10–P90' },
      ],
      applies: (r) => r.distType === 'triangular' || r.distType === 'pert',
      format: (v, r) =>
        r.distType === 'triangular' || r.distType === 'pert' ? (v === 'p10-p90' ? 'P10–P90' : 'Min–max') : '',
    },
    {
      field: 'low',
      header: `Low${unit}`,
      kind: 'number',
      width: 100,
      applies: uses('low'),
      headerTooltip: 'Low (the P10 for lognormal and for P10–P90 ranges)',
    },
    {
      field: 'mode',
      header: `Most likely${unit}`,
      kind: 'number',
      width: 108,
      applies: uses('mode'),
      headerTooltip: 'Most likely (the value of a fixed amount)',
    },
    {
      field: 'high',
      header: `High${unit}`,
      kind: 'number',
      width: 100,
      applies: uses('high'),
      headerTooltip: 'High (the P90 for lognormal and for P10–P90 ranges)',
    },
    {
      field: 'mean',
      header: `Stated mean${unit}`,
      kind: 'number',
      width: 90,
      applies: uses('mean'),
      headerTooltip: 'The mean you state for a normal or lognormal distribution (not the computed mean)',
    },
    {
      field: 'sd',
      header: 'SD',
      kind: 'number',
      width: 80,
      applies: uses('sd'),
      headerTooltip: 'Standard deviation',
    },
  ];
}
