// What the pages see of a member's notice choices: a plain JSON shape that the service produces and the
// components render. No server code here, so client components may import it.
import type { OptionalMailKind } from '@/lib/mail/kinds';

export type NotificationPreferenceView = {
  kind: OptionalMailKind;
  title: string;
  description: string;
  enabled: boolean;
};
