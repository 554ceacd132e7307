import 'server-only';
// The assumptions and exclusions of a project: free text that estimators keep and every brief prints.
import { z } from 'zod';
import { readVersionField } from '@/lib/validation/project';
import type { Actor } from '@/lib/auth/actor';
import { can } from '@/lib/auth/roles';
import { forbidden } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { findProject, updateAudited } from './projects';
import { assertWritable } from './write-access';

export const NOTES_MAX_LENGTH = 8000;

export type ProjectNotes = { assumptions: string | null; exclusions: string | null };
/** The notes with the project version they were read at, which a change must send back. */
export type VersionedNotes = ProjectNotes & { version: number };

const noteField = (label: string) =>
  z
    .string({ message: `${label} must be text.` })
    .max(NOTES_MAX_LENGTH, {
      message: `${label} may be at most ${NOTES_MAX_LENGTH.toLocaleString('en')} characters.`,
    })
    .nullable()
    .optional()
    // Blank text means "none stated"; it is stored as null so that the brief can say so.
    .transform((v) => (v && v.trim() ? v.trim() : null));

export const projectNotesSchema = z.object({
  assumptions: noteField('Assumptions'),
  exclusions: noteField('Exclusions'),
  version: readVersionField,
});

export async function getProjectNotes(actor: Actor, projectId: number): Promise<VersionedNotes> {
  const project = await findProject(actor, projectId);
  return { ...notesOf(project), version: project.version };
}

/** A project's notes, with none stated as null. */
export const notesOf = (project: ProjectNotes): ProjectNotes => ({
  assumptions: project.assumptions ?? null,
  exclusions: project.exclusions ?? null,
});

export async function updateProjectNotes(
  actor: Actor,
  projectId: number,
  input: unknown,
): Promise<VersionedNotes> {
  if (!can(actor.role, 'project:write')) throw forbidden();
  const { version, ...notes } = parseOrThrow(projectNotesSchema, input);
  const project = await findProject(actor, projectId);
  await assertWritable(actor.organizationId);
  await updateAudited(actor, project, 'project-notes', notesOf(project), notes, version);
  return { ...notes, version: project.version };
}
