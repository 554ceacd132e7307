// POST /api/projects/:id/import
//   multipart/form-data { file, register: items|risks|activities|correlations|all, mode: preview|commit }
//     → a preview of a CSV/XLSX file (columns mapped, row problems), or its commit in one transaction;
//   a model file (.json upload, or a JSON body) → replaces the project's registers.
import { NextResponse } from 'next/server';
import { z } from 'zod';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { badRequest, tooLarge } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { REGISTER_KINDS } from '@/lib/validation/registers';
import { importModel } from '@/lib/services/model-file';
import { commitImport, previewImport } from '@/lib/services/registers/import';
import { assertSize, formatOf, MAX_FILE_BYTES } from '@/lib/services/registers/files';

type Ctx = { params: Promise<{ id: string }> };

const formSchema = z.object({
  register: z.enum([...REGISTER_KINDS, 'all'], {
    message: 'register is items, risks, activities, correlations, drivers or all.',
  }),
  mode: z.enum(['preview', 'commit'], { message: 'mode is preview or commit.' }).default('preview'),
});

export const POST = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:write');
  const projectId = idParam((await ctx.params).id, 'Project');
  const length = Number(request.headers.get('content-length') ?? 0);
  if (length > MAX_FILE_BYTES + 64 * 1024) {
    throw tooLarge(`The upload is ${(length / 1048576).toFixed(1)} MB; files up to 10 MB are accepted.`);
  }
  const type = request.headers.get('content-type') ?? '';
  if (type.includes('application/json')) {
    return NextResponse.json({ imported: await importModel(actor, projectId, await readJson(request)) });
  }
  if (!type.includes('multipart/form-data')) throw badRequest('Upload the file as multipart/form-data.');
  const form = await request.formData().catch(() => {
    throw badRequest('The upload could not be read.');
  });
  const file = form.get('file');
  if (!(file instanceof File))
    throw badRequest('file: choose a file to upload.', [{ path: 'file', message: 'Choose a file.' }]);
  assertSize(file.size);
  const bytes = await file.arrayBuffer();
  if (formatOf(file.name) === 'json') {
    let model: unknown;
    try {
      model = JSON.parse(new TextDecoder().decode(bytes));
    } catch {
      throw badRequest(`${file.name} is not valid JSON.`, [{ path: 'file', message: 'Not valid JSON.' }]);
    }
    return NextResponse.json({ imported: await importModel(actor, projectId, model) });
  }
  const { register, mode } = parseOrThrow(formSchema, {
    register: form.get('register') ?? undefined,
    mode: form.get('mode') ?? undefined,
  });
  const upload = { name: file.name, bytes };
  if (mode === 'preview') return NextResponse.json(await previewImport(actor, projectId, upload, register));
  return NextResponse.json(await commitImport(actor, projectId, upload, register));
});
