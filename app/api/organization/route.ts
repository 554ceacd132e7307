import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { getOrganizationSettings, updateOrganizationSettings } from '@/lib/services/organization-settings';

// The organisation's own settings: owners only.
export const GET = handle(async () => {
  const actor = await requireActor('organization:manage');
  return NextResponse.json({ organization: await getOrganizationSettings(actor) });
});

export const PUT = handle(async (request: Request) => {
  const actor = await requireActor('organization:manage');
  return NextResponse.json({
    organization: await updateOrganizationSettings(actor, await readJson(request)),
  });
});
