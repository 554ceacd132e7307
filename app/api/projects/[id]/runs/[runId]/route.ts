import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getRun } from '@/lib/services/runs';

type Ctx = { params: Promise<{ id: string; runId: string }> };

/** A run's status and progress (polled by the page while it runs). */
export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:read');
  const { id, runId } = await ctx.params;
  const run = await getRun(actor, idParam(id, 'Project'), idParam(runId, 'Run'));
  return NextResponse.json({ run }, { headers: { 'cache-control': 'no-store' } });
});
