import { NextResponse } from 'next/server';
import { z } from 'zod';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getProject, setArchived, updateProject } from '@/lib/services/projects';
import { parseOrThrow } from '@/lib/validation/parse';

type Ctx = { params: Promise<{ id: string }> };

export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:read');
  return NextResponse.json({ project: await getProject(actor, idParam((await ctx.params).id, 'Project')) });
});

export const PUT = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:write');
  const id = idParam((await ctx.params).id, 'Project');
  return NextResponse.json({ project: await updateProject(actor, id, await readJson(request)) });
});

const archiveSchema = z.object({ archived: z.boolean({ message: 'archived must be true or false.' }) });

export const PATCH = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:write');
  const id = idParam((await ctx.params).id, 'Project');
  const { archived } = parseOrThrow(archiveSchema, await readJson(request));
  return NextResponse.json({ project: await setArchived(actor, id, archived) });
});
