import { requirePageActor } from '@/lib/auth/guard';
import { getOrganizationSettings } from '@/lib/services/organization-settings';
import { SelfApprovalSetting } from '@/components/settings/self-approval-setting';
import { JointConfidenceSetting } from '@/components/settings/joint-confidence-setting';

export const metadata = { title: 'Organisation' };

export default async function OrganizationPage() {
  const actor = await requirePageActor('organization:manage', '/settings/organization');
  const settings = await getOrganizationSettings(actor);
  return (
    <div className="max-w-3xl space-y-4">
      <h1 className="text-2xl font-semibold">Organisation: {settings.name}</h1>
      <SelfApprovalSetting initial={settings} />
      <JointConfidenceSetting initial={settings} />
    </div>
  );
}
