import { Notice } from '@/components/ui/notice';
import { failureMessage } from './api';

/** A failed call's reason as an alert; nothing while there is no failure. */
export function FailureNotice({ error, fallback }: { error: unknown; fallback?: string }) {
  if (!error) return null;
  return <Notice tone="invalid">{failureMessage(error, fallback)}</Notice>;
}
