import type { Metadata } from 'next';
import { AddDeliverable } from '@/components/sponsors/add-deliverable';
import { DealTermsForm } from '@/components/sponsors/deal-terms-form';
import { DeleteDealButton } from '@/components/sponsors/delete-deal-button';
import { DeliverableCard } from '@/components/sponsors/deliverable-card';
import { Breadcrumb } from '@/components/ui/breadcrumb';
import { pageAccess } from '@/lib/auth/page-access';
import { requireMember } from '@/lib/auth/session';
import { listCrew } from '@/lib/crew/queries';
import { orNotFound, uuidOr404 } from '@/lib/page-data';
import { now } from '@/lib/clock/queries';
import { dayOf } from '@/lib/sponsors/dates';
import { findDeal, listEpisodeChoices } from '@/lib/sponsors/deliverable-queries';
import { formatMoney } from '@/lib/sponsors/money';
import { invoiceStateLabels } from '@/lib/sponsors/schemas';

export const metadata: Metadata = { title: 'Sponsor deal' };

export default async function DealPage({ params }: { params: Promise<{ channel: string; dealId: string }> }) {
  const { channel, dealId } = await params;
  const member = await requireMember(channel, pageAccess.sponsorDeal.capability);
  const [deal, episodes, crew] = await orNotFound(
    Promise.all([findDeal(member.channel.id, uuidOr404(dealId), member.channel.speakingRateWpm), listEpisodeChoices(member.channel.id), listCrew(member.channel.id)]),
  );
  const slug = member.channel.slug;
  // The app clock, so the overdue marks agree with the reminder e-mails (and a test can move it).
  const today = dayOf(await now());
  const crewChoices = crew.map((c) => ({ userId: c.userId, name: c.name }));
  return (
    <>
      <Breadcrumb items={[{ href: `/c/${slug}/sponsors`, label: 'Sponsors' }]} />
      <header className="mb-6 flex flex-wrap items-end justify-between gap-3 border-b border-paper-edge pb-4">
        <div>
          <p className="text-sm font-bold uppercase tracking-wide text-ink-faint">{deal.sponsor.name}</p>
          <h1 className="text-2xl font-bold tracking-tight">{deal.title}</h1>
          <p className="mt-1 text-ink-soft">
            <span className="font-mono">{formatMoney(deal.feeMinor, deal.currency)}</span> · {invoiceStateLabels[deal.invoiceState]} · payment {deal.paymentTermsDays} days
            {deal.sponsor.contacts.length ? ` · ${deal.sponsor.contacts.map((c) => `${c.name} <${c.email}>`).join(', ')}` : ''}
          </p>
        </div>
        <DeleteDealButton channelSlug={slug} dealId={deal.id} />
      </header>
      <section aria-labelledby="deliverables-heading" className="space-y-4">
        <h2 id="deliverables-heading" className="text-lg font-bold">
          Deliverables
        </h2>
        {deal.deliverables.map((d) => (
          <DeliverableCard key={d.id} channelSlug={slug} deliverable={d} episodes={episodes} crew={crewChoices} today={today} contactEmail={deal.sponsor.contacts[0]?.email ?? ''} />
        ))}
        <AddDeliverable channelSlug={slug} dealId={deal.id} episodes={episodes} crew={crewChoices} startOpen={deal.deliverables.length === 0} />
      </section>
      <section aria-labelledby="terms-heading" className="mt-8 rounded-card border border-paper-edge bg-white/60 p-5 shadow-card">
        <h2 id="terms-heading" className="mb-3 text-lg font-bold">
          Terms and invoice
        </h2>
        <DealTermsForm channelSlug={slug} deal={deal} />
      </section>
    </>
  );
}
