import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getProjectNotes, updateProjectNotes } from '@/lib/services/project-notes';

type Ctx = { params: Promise<{ id: string }> };

export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:read');
  return NextResponse.json({
    notes: await getProjectNotes(actor, idParam((await ctx.params).id, 'Project')),
  });
});

/** Replaces both texts: a field left out or blank is cleared. */
export const PUT = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:write');
  const id = idParam((await ctx.params).id, 'Project');
  return NextResponse.json({ notes: await updateProjectNotes(actor, id, await readJson(request)) });
});
