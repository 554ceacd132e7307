'use client';
// Edit and archive (or restore) a project from the list.
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/button';
import { callApi, ApiError } from '@/components/forms/api';
import type { ProjectView } from '@/lib/view-types/projects';
import { NewProjectForm } from './new-project-form';

export function ProjectActions({ project }: { project: ProjectView }) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function archive() {
    setError(null);
    try {
      await callApi(`/api/projects/${project.id}`, {
        method: 'PATCH',
        body: { archived: !project.archived },
      });
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not change the project.');
    }
  }
  return (
    <div className="flex items-center justify-end gap-1">
      <Button variant="ghost" onClick={() => setEditing((v) => !v)} aria-label={`Edit ${project.code}`}>
        Edit
      </Button>
      <Button
        variant="ghost"
        onClick={archive}
        aria-label={`${project.archived ? 'Restore' : 'Archive'} ${project.code}`}
      >
        {project.archived ? 'Restore' : 'Archive'}
      </Button>
      {error ? <span className="text-xs text-invalid">{error}</span> : null}
      {editing ? (
        <div
          className="fixed inset-0 z-40 flex items-start justify-center bg-ink/30 p-10"
          role="dialog"
          aria-label={`Edit ${project.code}`}
        >
          <div className="w-full max-w-3xl rounded border border-rule bg-paper-raised p-4 text-left">
            <div className="mb-2 flex justify-between">
              <h2 className="font-semibold">Edit {project.code}</h2>
              <Button variant="ghost" onClick={() => setEditing(false)}>
                Close
              </Button>
            </div>
            <NewProjectForm project={project} onDone={() => setEditing(false)} />
          </div>
        </div>
      ) : null}
    </div>
  );
}
