import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { listRuns, startRun } from '@/lib/services/runs';

type Ctx = { params: Promise<{ id: string }> };

export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:read');
  const projectId = idParam((await ctx.params).id, 'Project');
  return NextResponse.json({ runs: await listRuns(actor, projectId) });
});

/** Starts a run: answers at once with the run, queued; the engine works after the reply. */
export const POST = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:start');
  const projectId = idParam((await ctx.params).id, 'Project');
  const run = await startRun(actor, projectId, await readJson(request));
  return NextResponse.json({ run }, { status: 201 });
});
