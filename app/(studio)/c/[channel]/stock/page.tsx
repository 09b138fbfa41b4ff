import type { Metadata } from 'next';
import { OnHandList } from '@/components/stock/on-hand-list';
import { StockRack } from '@/components/stock/stock-rack';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/policy';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { listOnHand } from '@/lib/on-hand/queries';
import { getCutSettings, listStock } from '@/lib/stock/queries';

export const metadata: Metadata = { title: 'Stock rack' };

export default async function StockPage({ params }: { params: Promise<{ channel: string }> }) {
  const member = await requireMember((await params).channel, pageAccess.stockRack.capability);
  const [stock, settings, onHand] = await Promise.all([listStock(member.channel.id), getCutSettings(member.channel.id), listOnHand(member.channel.id)]);
  const canEdit = can(member.role, 'cutlist.edit');
  return (
    <>
      <PageHeader title="Stock rack">The lumber and sheet goods your store sells, with the sizes on sale and their prices.{canEdit ? '' : ' Read-only for Editors.'}</PageHeader>
      <StockRack channelSlug={member.channel.slug} canEdit={canEdit} initialStock={stock} initialSettings={settings} />
      <div className="mt-10 border-t border-paper-edge pt-6">
        <OnHandList channelSlug={member.channel.slug} canEdit={canEdit} initialStock={stock} initialPieces={onHand} unit={settings.lengthUnit} />
      </div>
    </>
  );
}
