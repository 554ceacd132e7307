import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getDecision } from '@/lib/services/approvals';

type Ctx = { params: Promise<{ id: string; decisionId: string }> };

// Read only: a recorded decision is never edited or removed (PUT, PATCH, DELETE answer 405).
export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:read');
  const { id, decisionId } = await ctx.params;
  return NextResponse.json({
    decision: await getDecision(actor, idParam(id, 'Project'), idParam(decisionId, 'Decision')),
  });
});
