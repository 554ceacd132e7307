import 'server-only';
// The schedule's health check on the network a run would read (the registers exported as the
// model file), for the run form.
import type { Actor } from '@/lib/auth/actor';
import { scheduleHealth, type HealthFinding } from '@/lib/domain/schedule-health';
import { exportModel } from './model-file';

export type ScheduleHealthView = { findings: HealthFinding[]; activityCount: number };

export async function scheduleHealthOf(actor: Actor, projectId: number): Promise<ScheduleHealthView> {
  const activities = (await exportModel(actor, projectId)).activities ?? [];
  return { findings: scheduleHealth(activities), activityCount: activities.length };
}
