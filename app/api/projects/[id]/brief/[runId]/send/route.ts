import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { sendBriefToSponsors } from '@/lib/services/brief';

type Ctx = { params: Promise<{ id: string; runId: string }> };

/** Puts the brief before the organisation's sponsors by e-mail. */
export const POST = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:write');
  const { id, runId } = await ctx.params;
  return NextResponse.json(await sendBriefToSponsors(actor, idParam(id, 'Project'), idParam(runId, 'Run')));
});
