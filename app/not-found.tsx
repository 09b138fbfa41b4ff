import Link from 'next/link';
import { buttonClasses } from '@/components/ui/button';
import { Logo } from '@/components/ui/logo';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-md px-6 py-20 text-center">
      <Logo className="text-xl" />
      <h1 className="mt-8 text-2xl font-bold">Not found</h1>
      <p className="mt-2 text-ink-soft">There is nothing here, or it belongs to a channel you are not crew on.</p>
      <Link href="/" className={buttonClasses('secondary', 'mt-6')}>
        Go to my channel
      </Link>
    </main>
  );
}
