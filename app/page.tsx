import { redirect } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/session';
import { listChannelsForUser } from '@/lib/channels/queries';
import { channelPage } from '@/lib/api/paths';

export default async function Home() {
  const user = await getCurrentUser();
  if (!user) redirect('/sign-in');
  const [first] = await listChannelsForUser(user.id);
  redirect(first ? channelPage(first.slug) : '/welcome');
}
