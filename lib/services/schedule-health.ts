import 'server-only';
// The schedule's health check on the network a run would read (the registers exported as the
// model file), for the run form.
import type { Actor } from '@/lib/auth/actor';
import { scheduleHealth, type HealthFinding } from '@/lib/domain/schedule-health';
import type { Model } from '@/lib/sim';
import { exportModel } from './model-file';

export type ScheduleHealthView = { findings: HealthFinding[]; activityCount: number };

export async function scheduleHealthOf(actor: Actor, projectId: number): Promise<ScheduleHealthView> {
  return scheduleHealthOfModel(await exportModel(actor, projectId));
}

/** The health check of a model already exported (the run form reads the model for its notices too). */
export function scheduleHealthOfModel(model: Model): ScheduleHealthView {
  const activities = model.activities ?? [];
  return { findings: scheduleHealth(activities), activityCount: activities.length };
}
