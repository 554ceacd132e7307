// What the pages see of a project's audit trail. The shape is produced by the registers
// service; it is named here so that client components take it from a module of types.
export type { AuditView } from '@/lib/services/registers/read';
