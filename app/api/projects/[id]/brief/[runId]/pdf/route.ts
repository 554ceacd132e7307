import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getBrief } from '@/lib/services/brief';
import { renderBriefPdf } from '@/lib/brief/pdf/document';
import { briefFileName } from '@/lib/brief/pdf/file-name';

type Ctx = { params: Promise<{ id: string; runId: string }> };

// pdfkit needs Node's streams and buffers.
export const runtime = 'nodejs';

/** The brief as a PDF, A4 by default or US Letter with ?paper=letter. */
export const GET = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('brief:read');
  const { id, runId } = await ctx.params;
  const brief = await getBrief(actor, idParam(id, 'Project'), idParam(runId, 'Run'));
  const paper = new URL(request.url).searchParams.get('paper') === 'letter' ? 'LETTER' : 'A4';
  const pdf = await renderBriefPdf(brief, { paper });
  return new Response(new Uint8Array(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="${briefFileName(brief)}"`,
      'cache-control': 'private, no-store',
    },
  });
});
