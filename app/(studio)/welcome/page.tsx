import type { Metadata } from 'next';
import { NewChannelForm } from '@/components/settings/new-channel-form';
import { Logo } from '@/components/ui/logo';
import { requireUser } from '@/lib/auth/session';
import { listChannelsForUser } from '@/lib/channels/queries';

export const metadata: Metadata = { title: 'New channel' };

export default async function WelcomePage() {
  const user = await requireUser();
  const channels = await listChannelsForUser(user.id);
  return (
    <main className="mx-auto max-w-md px-4 py-12">
      <Logo className="text-2xl" />
      <h1 className="mt-8 text-xl font-bold">{channels.length ? 'Start another channel' : 'You are not on a channel yet'}</h1>
      <p className="mt-2 text-ink-soft">
        Create a channel and you become its Host. To join someone else’s channel, open the invitation link they sent you.
      </p>
      <NewChannelForm />
    </main>
  );
}
