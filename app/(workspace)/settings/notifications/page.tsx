import { requirePageActor } from '@/lib/auth/guard';
import { listNotificationPreferences } from '@/lib/services/notifications';
import { NotificationSettings } from '@/components/notifications/notification-settings';

export const metadata = { title: 'Notices' };

export default async function NotificationsPage() {
  const actor = await requirePageActor(undefined, '/settings/notifications');
  const preferences = await listNotificationPreferences(actor);
  return (
    <div className="max-w-3xl space-y-4">
      <h1 className="text-2xl font-semibold">Notices by e-mail</h1>
      <p className="text-sm text-ink-soft">
        Choose which notices Outturn sends to <strong className="text-ink">{actor.email}</strong>. Invitations
        and password-reset links are always sent, because you or an owner asked for them.
      </p>
      <NotificationSettings initial={preferences} />
    </div>
  );
}
