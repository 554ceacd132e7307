// What the pages see of a run. The shape is produced by the runs service; it is named here so
// that client components take it from a module of types rather than from the service.
export type { RunView } from '@/lib/services/runs/view';
export type { RunStatus, RunSummary } from '@/models/simulation-run';
