'use client';

import { Button } from '@/components/ui/button';

export default function WorkspaceError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="max-w-lg py-10">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <p className="mt-2 text-ink-soft">
        Nothing you had saved was lost. Try again, or go back to your projects.
      </p>
      <Button className="mt-4" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
