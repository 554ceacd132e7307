import { ApiError } from '@/components/forms/api';

/** What a settings card says when the server refused a change or could not be reached. */
export function saveFailure(e: unknown): { tone: 'invalid'; text: string } {
  return {
    tone: 'invalid',
    text: e instanceof ApiError ? e.failure.message : 'The server could not be reached. Nothing was changed.',
  };
}
