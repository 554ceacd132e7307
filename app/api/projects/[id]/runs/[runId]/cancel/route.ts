import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { cancelRun } from '@/lib/services/runs';

type Ctx = { params: Promise<{ id: string; runId: string }> };

/** Cancels a queued or running run; answers once the engine has stopped. */
export const POST = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:cancel');
  const { id, runId } = await ctx.params;
  return NextResponse.json({ run: await cancelRun(actor, idParam(id, 'Project'), idParam(runId, 'Run')) });
});
