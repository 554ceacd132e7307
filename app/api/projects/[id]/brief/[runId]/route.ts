import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getBrief } from '@/lib/services/brief';

type Ctx = { params: Promise<{ id: string; runId: string }> };

export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('brief:read');
  const { id, runId } = await ctx.params;
  return NextResponse.json({ brief: await getBrief(actor, idParam(id, 'Project'), idParam(runId, 'Run')) });
});
