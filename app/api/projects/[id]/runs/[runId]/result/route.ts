import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getRunOutcome } from '@/lib/services/runs';

type Ctx = { params: Promise<{ id: string; runId: string }> };

/** The engine's result file of a run that succeeded, with the sample of its iterations. */
export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:read');
  const { id, runId } = await ctx.params;
  const { run, result, sample } = await getRunOutcome(actor, idParam(id, 'Project'), idParam(runId, 'Run'));
  return NextResponse.json({ run, result, sample });
});
