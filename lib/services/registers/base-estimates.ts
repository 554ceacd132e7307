import 'server-only';
// The base estimate and line count of many projects at once, for the projects list: one read of
// the line items and one of the activities for every project listed, of the columns a base
// depends on only, as plain rows (no model instances). Each row becomes the cells its register
// row holds (rows.ts) and the cells are summed by the grid's base rule
// (lib/registers/base-estimate), so the list shows the grid's total to the bit.

import { Activity, CostItem } from '@/models';
import { baseEstimate } from '@/lib/registers/base-estimate';
import {
  activityBaseCells,
  itemBaseCells,
  type ActivityBaseColumns,
  type ActivityRow,
  type ItemBaseColumns,
} from './rows';

export type ProjectEstimate = { baseEstimate: number; lineCount: number };

type ItemColumns = ItemBaseColumns & { projectId: number };
type ActivityColumns = ActivityBaseColumns & { id: number; projectId: number };

/** Rows grouped by project, each group in the order read. */
function byProject<T extends { projectId: number }>(rows: T[]): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const row of rows) {
    const group = out.get(row.projectId);
    if (group) group.push(row);
    else out.set(row.projectId, [row]);
  }
  return out;
}

/** Each project's base estimate and number of lines; a project without lines has 0 and 0. */
export async function baseEstimatesOf(
  organizationId: number,
  projectIds: number[],
): Promise<Map<number, ProjectEstimate>> {
  const out = new Map<number, ProjectEstimate>();
  if (projectIds.length === 0) return out;
  const where = { organizationId, projectId: projectIds };
  // The registers' own order (as the grid reads them), so that the sum adds in the same order.
  const order: [string, string][] = [
    ['projectId', 'ASC'],
    ['sortOrder', 'ASC'],
    ['id', 'ASC'],
  ];
  const [items, activities] = await Promise.all([
    CostItem.findAll({
      where,
      attributes: ['projectId', 'base', 'dist', 'ratePerDay', 'activityId', 'span'],
      order,
      raw: true,
    }) as unknown as Promise<ItemColumns[]>,
    Activity.findAll({
      where,
      attributes: ['id', 'projectId', 'code', 'duration', 'predecessors', 'existence'],
      order,
      raw: true,
    }) as unknown as Promise<ActivityColumns[]>,
  ]);
  const itemsOf = byProject(items);
  const activitiesOf = byProject(activities);
  for (const projectId of projectIds) {
    const lines = itemsOf.get(projectId) ?? [];
    const acts = activitiesOf.get(projectId) ?? [];
    const codeById = new Map(acts.map((a) => [a.id, a.code]));
    out.set(projectId, {
      baseEstimate: baseEstimate(
        lines.map((l) => itemBaseCells(l, codeById)),
        acts.map((a) => ({
          ...(activityBaseCells(a) as Pick<ActivityRow, 'code' | 'distType' | 'predecessors'>),
          existence: a.existence,
        })),
      ),
      lineCount: lines.length,
    });
  }
  return out;
}
