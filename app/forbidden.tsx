import Link from 'next/link';
import { buttonClasses } from '@/components/ui/button';

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-md px-6 py-20 text-center">
      <h1 className="text-2xl font-bold">Not for your role</h1>
      <p className="mt-2 text-ink-soft">
        Your role on this channel does not include this page. Ask a Host of the channel if you need it.
      </p>
      <Link href="/" className={buttonClasses('secondary', 'mt-6')}>
        Back to the dashboard
      </Link>
    </main>
  );
}
