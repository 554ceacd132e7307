import { ESTIMATE_CLASSES, STAGES } from '@/lib/validation/project';

/** What a new project can take from the top of a model file. */
export type ModelHeader = {
  name?: string;
  currency?: string;
  stage?: (typeof STAGES)[number];
  estimateClass?: (typeof ESTIMATE_CLASSES)[number];
  baseDate?: string;
};

const text = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : undefined);

/**
 * The project's name, currency, stage, estimate class and base date as a model file states them
 * (its `project` block holds the last three), or null when the text is not a model file. A value
 * the project form would refuse (an unknown stage, a class outside 1–5, a malformed date) is left
 * out, so that the form keeps its own.
 */
export function readModelHeader(fileText: string): ModelHeader | null {
  let json: Record<string, unknown>;
  try {
    json = JSON.parse(fileText) as Record<string, unknown>;
  } catch {
    return null;
  }
  if (json?.format !== 'outturn-model') return null;
  const project = (typeof json.project === 'object' && json.project ? json.project : {}) as Record<
    string,
    unknown
  >;
  const stage = STAGES.find((s) => s === text(project.stage));
  const estimateClass = ESTIMATE_CLASSES.find((c) => c === project.estimateClass);
  const baseDate = text(project.baseDate);
  return {
    name: text(json.name),
    currency: text(json.currency)?.toUpperCase().slice(0, 3),
    stage,
    estimateClass,
    baseDate: baseDate && /^\d{4}-\d{2}-\d{2}$/.test(baseDate) ? baseDate : undefined,
  };
}
